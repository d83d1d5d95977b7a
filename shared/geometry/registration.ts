import type { Vec2 } from './vec'
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

/** Closest point to p on a polyline (brute force over its segments; parts here have a few thousand points). */
export function closestOnPolyline(poly: readonly Vec2[], p: Vec2): Vec2 {
  let best: Vec2 = poly[0]
  let bestD = Infinity
  for (let i = 0; i + 1 < poly.length; i++) {
    const [a, b] = [poly[i], poly[i + 1]]
    const ex = b[0] - a[0]
    const ey = b[1] - a[1]
    const len2 = ex * ex + ey * ey
    const t = len2 > 0 ? Math.min(Math.max(((p[0] - a[0]) * ex + (p[1] - a[1]) * ey) / len2, 0), 1) : 0
    const q: Vec2 = [a[0] + t * ex, a[1] + t * ey]
    const d = (q[0] - p[0]) ** 2 + (q[1] - p[1]) ** 2
    if (d < bestD) {
      bestD = d
      best = q
    }
  }
  return best
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

/**
 * Registers a moving profile onto a fixed one on parts sharpening does not touch (DESIGN §6): moving part k (e.g.
 * the toe-pick teeth, the runner's top edge) onto fixed part k, by iterative closest points on the fixed
 * polylines with a closed-form rigid step (similarity with allowScale). Never pass the rocker here: it would
 * absorb the steel removed. Start from `initial` when the two are far apart.
 */
export function registerProfiles(
  fixedParts: readonly (readonly Vec2[])[],
  movingParts: readonly (readonly Vec2[])[],
  opts: { allowScale?: boolean; initial?: Similarity; spacingMm?: number; maxIterations?: number } = {},
): Registration {
  const moving = movingParts.map((part) => thin(part, opts.spacingMm ?? 0.5))
  let transform = opts.initial ?? IDENTITY
  let rms = Infinity
  let iterations = 0
  for (; iterations < (opts.maxIterations ?? 50); iterations++) {
    const src: Vec2[] = []
    const dst: Vec2[] = []
    moving.forEach((part, k) =>
      part.forEach((p) => {
        const q = applySimilarity(transform, p)
        src.push(q)
        dst.push(closestOnPolyline(fixedParts[k], q))
      }),
    )
    const next = Math.sqrt(src.reduce((s, p, i) => s + (p[0] - dst[i][0]) ** 2 + (p[1] - dst[i][1]) ** 2, 0) / src.length)
    transform = composeSimilarity(fitSimilarity(src, dst, opts.allowScale), transform)
    if (Math.abs(rms - next) < 1e-9) {
      rms = next
      break
    }
    rms = next
  }
  return { transform, rmsMm: rms, iterations }
}

/**
 * Steel removed along the blade (mm, + where the running surface has risen toward the top edge): the height of the
 * later rocker minus the earlier one at each station, both in the earlier analysis's blade frame (y up) after
 * registration. Null where either rocker does not reach the station.
 */
export function steelRemoved(
  before: readonly Vec2[],
  after: readonly Vec2[],
  stationsMm: readonly number[],
): { alongMm: number; removedMm: number | null }[] {
  const sortX = (pts: readonly Vec2[]) => [...pts].sort((a, b) => a[0] - b[0])
  const [b, a] = [sortX(before), sortX(after)]
  return stationsMm.map((x) => {
    const yb = interpolateY(b, x)
    const ya = interpolateY(a, x)
    return { alongMm: x, removedMm: yb === null || ya === null ? null : ya - yb }
  })
}
