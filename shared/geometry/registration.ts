import type { Vec2 } from './vec'
import { solve } from './linalg'
import { centroid, interpolateY } from './vec'

/** p ↦ s·R(θ)·p + t, in the units of the points (mm). */
export interface Similarity {
  scale: number
  rotationRad: number
  tx: number
  ty: number
}

export const IDENTITY: Similarity = { scale: 1, rotationRad: 0, tx: 0, ty: 0 }

export function applySimilarity(t: Similarity, p: Vec2): Vec2 {
  const c = Math.cos(t.rotationRad) * t.scale
  const s = Math.sin(t.rotationRad) * t.scale
  return [c * p[0] - s * p[1] + t.tx, s * p[0] + c * p[1] + t.ty]
}

/** a ∘ b: apply b first, then a. */
export function composeSimilarity(a: Similarity, b: Similarity): Similarity {
  const [tx, ty] = applySimilarity(a, [b.tx, b.ty])
  return { scale: a.scale * b.scale, rotationRad: a.rotationRad + b.rotationRad, tx, ty }
}

/** Mirrors points across the y axis (x ↦ −x), to compare a left blade with a right one in the card frame. */
export const mirrorX = (points: readonly Vec2[]): Vec2[] => points.map((p): Vec2 => [-p[0], p[1]])

/**
 * Least-squares rigid (or, with allowScale, similarity) transform taking src[i] onto dst[i]: the closed form of
 * Umeyama (IEEE PAMI 13(4), 1991) specialised to 2-D.
 */
export function fitSimilarity(src: readonly Vec2[], dst: readonly Vec2[], allowScale = false): Similarity {
  if (src.length !== dst.length || src.length < 2) throw new RangeError('need ≥ 2 point pairs')
  const ms = centroid(src)
  const md = centroid(dst)
  let a = 0
  let b = 0
  let ss = 0
  for (let i = 0; i < src.length; i++) {
    const sx = src[i][0] - ms[0]
    const sy = src[i][1] - ms[1]
    const dx = dst[i][0] - md[0]
    const dy = dst[i][1] - md[1]
    a += sx * dx + sy * dy
    b += sx * dy - sy * dx
    ss += sx * sx + sy * sy
  }
  const rotationRad = Math.atan2(b, a)
  const scale = allowScale && ss > 0 ? Math.hypot(a, b) / ss : 1
  const rotated = applySimilarity({ scale, rotationRad, tx: 0, ty: 0 }, ms)
  return { scale, rotationRad, tx: md[0] - rotated[0], ty: md[1] - rotated[1] }
}

/** Closest point to p on a polyline, by brute force over its segments. */
export function closestOnPolyline(poly: readonly Vec2[], p: Vec2): Vec2 {
  return nearestOnSegments(poly, p, 0, poly.length - 1).point
}

interface Nearest {
  point: Vec2
  /** Unit normal of the segment the point lies on. */
  normal: Vec2
  d2: number
}

function nearestOnSegments(poly: readonly Vec2[], p: Vec2, from: number, to: number): Nearest {
  let best: Nearest = { point: poly[from], normal: [0, 1], d2: Infinity }
  for (let i = Math.max(from, 0); i < Math.min(to, poly.length - 1); i++) {
    const [a, b] = [poly[i], poly[i + 1]]
    const ex = b[0] - a[0]
    const ey = b[1] - a[1]
    const len2 = ex * ex + ey * ey
    const t = len2 > 0 ? Math.min(Math.max(((p[0] - a[0]) * ex + (p[1] - a[1]) * ey) / len2, 0), 1) : 0
    const q: Vec2 = [a[0] + t * ex, a[1] + t * ey]
    const d2 = (q[0] - p[0]) ** 2 + (q[1] - p[1]) ** 2
    if (d2 < best.d2) {
      const len = Math.sqrt(len2) || 1
      best = { point: q, normal: [-ey / len, ex / len], d2 }
    }
  }
  return best
}

/**
 * Segments of one polyline bucketed on a square grid, so each nearest-point query looks at a few cells, not at
 * every segment.
 */
class SegmentGrid {
  private readonly cells = new Map<string, number[]>()

  constructor(private readonly poly: readonly Vec2[], private readonly cell = 2) {
    for (let i = 0; i + 1 < poly.length; i++) {
      const key = this.key((poly[i][0] + poly[i + 1][0]) / 2, (poly[i][1] + poly[i + 1][1]) / 2)
      const list = this.cells.get(key)
      if (list) list.push(i)
      else this.cells.set(key, [i])
    }
  }

  private key(x: number, y: number): string {
    return `${Math.floor(x / this.cell)},${Math.floor(y / this.cell)}`
  }

  nearest(p: Vec2): Nearest {
    const [cx, cy] = [Math.floor(p[0] / this.cell), Math.floor(p[1] / this.cell)]
    for (let ring = 1; ring < 64; ring *= 2) {
      let best: Nearest | null = null
      for (let i = cx - ring; i <= cx + ring; i++)
        for (let j = cy - ring; j <= cy + ring; j++)
          for (const k of this.cells.get(`${i},${j}`) ?? []) {
            const n = nearestOnSegments(this.poly, p, k, k + 1)
            if (!best || n.d2 < best.d2) best = n
          }
      // A hit within (ring − 1) cells is certainly the nearest; farther hits need a wider ring to be sure.
      if (best && Math.sqrt(best.d2) <= (ring - 0.5) * this.cell) return best
    }
    return nearestOnSegments(this.poly, p, 0, this.poly.length - 1)
  }
}

export interface Registration {
  /** Takes the moving profile onto the fixed one. */
  transform: Similarity
  /** RMS distance of the moved reference points from the fixed parts after registration (mm). */
  rmsMm: number
  iterations: number
}

/** Keeps about one point per spacingMm of a polyline, so long straight parts do not outweigh the pick teeth. */
function thin(points: readonly Vec2[], spacingMm: number): Vec2[] {
  const out: Vec2[] = []
  for (const p of points) {
    const last = out[out.length - 1]
    if (!last || Math.hypot(p[0] - last[0], p[1] - last[1]) >= spacingMm) out.push(p)
  }
  return out
}

function centroidShift(fixed: readonly Vec2[], moving: readonly Vec2[]): Similarity {
  const [f, m] = [centroid(fixed), centroid(moving)]
  return { scale: 1, rotationRad: 0, tx: f[0] - m[0], ty: f[1] - m[1] }
}

/**
 * One Gauss–Newton step of point-to-line ICP: minimises Σ (n·(p″ − q))² over a small rotation θ (and scale σ)
 * about the centroid c of the moved points and a shift t, p″ = c + (1 + σ)R(θ)(p − c) + t. Point-to-line lets
 * points slide along straight parts such as the top edge, which point-to-point ICP resists.
 */
function pointToLineStep(src: readonly Vec2[], hits: readonly Nearest[], allowScale: boolean): Similarity | null {
  const c = centroid(src)
  const m = allowScale ? 4 : 3
  const ata = Array.from({ length: m }, () => new Array<number>(m).fill(0))
  const atb = new Array<number>(m).fill(0)
  src.forEach((p, i) => {
    const { point: q, normal: n } = hits[i]
    const [dx, dy] = [p[0] - c[0], p[1] - c[1]]
    const row = [n[0] * -dy + n[1] * dx, n[0], n[1], n[0] * dx + n[1] * dy].slice(0, m)
    const r = n[0] * (p[0] - q[0]) + n[1] * (p[1] - q[1])
    for (let a = 0; a < m; a++) {
      atb[a] -= row[a] * r
      for (let b = 0; b < m; b++) ata[a][b] += row[a] * row[b]
    }
  })
  const x = solve(ata, atb)
  if (!x) return null
  const step: Similarity = { scale: 1 + (allowScale ? x[3] : 0), rotationRad: x[0], tx: 0, ty: 0 }
  const rc = applySimilarity(step, c)
  return { ...step, tx: c[0] + x[1] - rc[0], ty: c[1] + x[2] - rc[1] }
}

/**
 * Registers a moving profile onto a fixed one on parts sharpening does not touch (DESIGN §6): moving part k (e.g.
 * the toe-pick teeth, the runner's top edge) onto fixed part k, by point-to-line iterative closest points (rigid,
 * or similarity with allowScale). Never pass the rocker here: it would absorb the steel removed. Starts from
 * `initial`, else from the shift that overlays the parts' centroids; the rotation between the two must then be
 * small (a few degrees), as it is between two photos of one setup.
 */
export function registerProfiles(
  fixedParts: readonly (readonly Vec2[])[],
  movingParts: readonly (readonly Vec2[])[],
  opts: { allowScale?: boolean; initial?: Similarity; spacingMm?: number; maxIterations?: number } = {},
): Registration {
  const grids = fixedParts.map((part) => new SegmentGrid(part))
  const moving = movingParts.map((part) => thin(part, opts.spacingMm ?? 0.5))
  let transform = opts.initial ?? centroidShift(fixedParts.flat(), moving.flat())
  let rms = Infinity
  let iterations = 0
  for (; iterations < (opts.maxIterations ?? 60); iterations++) {
    const src: Vec2[] = []
    const hits: Nearest[] = []
    moving.forEach((part, k) =>
      part.forEach((p) => {
        const q = applySimilarity(transform, p)
        src.push(q)
        hits.push(grids[k].nearest(q))
      }),
    )
    rms = Math.sqrt(hits.reduce((s, h) => s + h.d2, 0) / hits.length)
    const step = pointToLineStep(src, hits, opts.allowScale ?? false)
    if (!step) break
    transform = composeSimilarity(step, transform)
    if (Math.abs(step.rotationRad) < 1e-12 && Math.hypot(step.tx, step.ty) < 1e-9 && Math.abs(step.scale - 1) < 1e-12) break
  }
  return { transform, rmsMm: rms, iterations }
}

/** Mean height of the points within ±halfMm of x (x-sorted), which averages pixel noise; interpolated if sparse. */
function heightAt(sorted: readonly Vec2[], x: number, halfMm: number): number | null {
  if (!sorted.length || x < sorted[0][0] || x > sorted[sorted.length - 1][0]) return null
  let sum = 0
  let n = 0
  for (const p of sorted) {
    if (p[0] > x + halfMm) break
    if (p[0] >= x - halfMm) {
      sum += p[1]
      n++
    }
  }
  return n >= 3 ? sum / n : interpolateY(sorted, x)
}

/**
 * Steel removed along the blade (mm, + where the running surface has risen toward the top edge): the height of the
 * later rocker minus the earlier one at each station, both in the earlier analysis's blade frame (y up) after
 * registration, each averaged over ±halfWindowMm (1 mm) so single noisy points do not dominate; over 2 mm a 2 m
 * rocker's own curve biases both heights alike by under 0.1 µm. Null where either rocker does not reach a station.
 */
export function steelRemoved(
  before: readonly Vec2[],
  after: readonly Vec2[],
  stationsMm: readonly number[],
  halfWindowMm = 1,
): { alongMm: number; removedMm: number | null }[] {
  const sortX = (pts: readonly Vec2[]) => [...pts].sort((a, b) => a[0] - b[0])
  const [b, a] = [sortX(before), sortX(after)]
  return stationsMm.map((x) => {
    const yb = heightAt(b, x, halfWindowMm)
    const ya = heightAt(a, x, halfWindowMm)
    return { alongMm: x, removedMm: yb === null || ya === null ? null : ya - yb }
  })
}
