import { cumulative } from './clean'
import { fitLine, intersect, type Line } from './subpixel'

type Pt = [number, number]

/**
 * Restoring the toe picks' sharp corners. Blur rounds a tooth's tip off and the segmentation may lose its last
 * millimetre altogether, yet the tip's height decides the touch point (an error Δh at B moves T by about R·Δh/|BT|,
 * some 40 × Δh). The faces either side of a tip are straight and traced well away from it, so the tip is put back
 * where those faces, extended, meet — the way a marker corner is found from its sides.
 */

export interface TipOptions {
  /** Only corners within this distance, in card x, of the edge's first point (the toe end), mm. */
  zoneMm: number
  /** Douglas–Peucker tolerance that splits the edge into straight faces, mm. */
  toleranceMm: number
  /** Shortest face used, mm; and how much of each face end is left out of its line fit (the rounded part), mm. */
  minFaceMm: number
  trimMm: number
  /** Longest stretch between two faces (rounded or missing) that a corner may replace, mm. */
  maxBridgeMm: number
  /** Smallest turn between two faces that counts as a corner, degrees. */
  minTurnDeg: number
  /** Pieces turning by less than this are one face, degrees. */
  mergeTurnDeg: number
}

export const DEFAULT_TIP_OPTIONS: TipOptions = {
  zoneMm: 45, toleranceMm: 0.1, minFaceMm: 1.4, trimMm: 0.5, maxBridgeMm: 2, minTurnDeg: 35, mergeTurnDeg: 20,
}

/** Vertex indices of the Douglas–Peucker simplification of pts[from..to] (iterative, so long edges cannot overflow). */
export function douglasPeucker(pts: Pt[], from: number, to: number, tol: number): number[] {
  const keep = new Uint8Array(pts.length)
  keep[from] = 1
  keep[to] = 1
  const stack: [number, number][] = [[from, to]]
  while (stack.length) {
    const [a, b] = stack.pop() as [number, number]
    const [ax, ay] = pts[a]
    const dx = pts[b][0] - ax
    const dy = pts[b][1] - ay
    const len = Math.hypot(dx, dy)
    let worst = -1
    let worstD = tol
    for (let i = a + 1; i < b; i++) {
      const d = len > 0 ? Math.abs(dx * (pts[i][1] - ay) - dy * (pts[i][0] - ax)) / len : Math.hypot(pts[i][0] - ax, pts[i][1] - ay)
      if (d > worstD) {
        worstD = d
        worst = i
      }
    }
    if (worst < 0) continue
    keep[worst] = 1
    stack.push([a, worst], [worst, b])
  }
  const out: number[] = []
  for (let i = from; i <= to; i++) if (keep[i]) out.push(i)
  return out
}

/**
 * Joins consecutive Douglas–Peucker pieces that turn by less than `maxTurnDeg` into one run (index pairs): a tooth's
 * face traced with a slight bend near its blurred tip is split into pieces too short to fit on their own.
 */
function straightRuns(pts: Pt[], vertices: number[], maxTurnDeg: number): [number, number][] {
  const runs: [number, number][] = []
  const cosMax = Math.cos((maxTurnDeg * Math.PI) / 180)
  const dir = (a: number, b: number): Pt => {
    const len = Math.hypot(pts[b][0] - pts[a][0], pts[b][1] - pts[a][1]) || 1
    return [(pts[b][0] - pts[a][0]) / len, (pts[b][1] - pts[a][1]) / len]
  }
  for (let k = 0; k + 1 < vertices.length; k++) {
    const last = runs[runs.length - 1]
    const piece = dir(vertices[k], vertices[k + 1])
    if (last && last[1] === vertices[k]) {
      const run = dir(last[0], last[1])
      if (run[0] * piece[0] + run[1] * piece[1] >= cosMax) {
        last[1] = vertices[k + 1]
        continue
      }
    }
    runs.push([vertices[k], vertices[k + 1]])
  }
  return runs
}

interface Face {
  /** Arc-length span of the face along the edge, mm. */
  from: number
  to: number
  line: Line
  /** Unit direction of travel along the edge. */
  travel: Pt
}

/** The straight faces of the edge's first `zoneMm`: Douglas–Peucker pieces long enough, each refitted without its ends. */
function facesOf(pts: Pt[], s: Float64Array, o: TipOptions, zoneArc: number): Face[] {
  let end = 0
  while (end < pts.length - 1 && s[end] < zoneArc + o.maxBridgeMm + o.minFaceMm) end++
  if (end < 2) return []
  const vertices = douglasPeucker(pts, 0, end, o.toleranceMm)
  const faces: Face[] = []
  for (const [a, b] of straightRuns(pts, vertices, o.mergeTurnDeg)) {
    if (s[b] - s[a] < o.minFaceMm) continue
    const inner = pts.filter((_, i) => i >= a && i <= b && s[i] >= s[a] + o.trimMm && s[i] <= s[b] - o.trimMm)
    if (inner.length < 4) continue
    const line = fitLine(inner)
    if (!line) continue
    // The line's direction, (ny, −nx), turned to run the way the edge does.
    const chord: Pt = [pts[b][0] - pts[a][0], pts[b][1] - pts[a][1]]
    const sign = chord[0] * line.ny - chord[1] * line.nx >= 0 ? 1 : -1
    faces.push({ from: s[a], to: s[b], line, travel: [sign * line.ny, -sign * line.nx] })
  }
  return faces
}

/**
 * Replaces the rounded or missing stretch between consecutive straight faces that turn by more than minTurnDeg by
 * the faces' intersection, within the zone at the edge's start. Points are card or strip coordinates in one unit (mm).
 */
export function restoreTips(pts: Pt[], options: Partial<TipOptions> = {}): Pt[] {
  const o = { ...DEFAULT_TIP_OPTIONS, ...options }
  const s = cumulative(pts)
  // The zone in arc length: the teeth zigzag, so their arc is far longer than their extent along the blade.
  let zoneEnd = 0
  while (zoneEnd < pts.length - 1 && Math.abs(pts[zoneEnd][0] - pts[0][0]) <= o.zoneMm) zoneEnd++
  const zoneArc = s[zoneEnd]
  const faces = facesOf(pts, s, o, zoneArc)
  const corners: { from: number; to: number; at: Pt }[] = []
  for (let k = 0; k + 1 < faces.length; k++) {
    const [f, g] = [faces[k], faces[k + 1]]
    if (g.from - f.to > o.maxBridgeMm || f.to > zoneArc) continue
    const cos = f.travel[0] * g.travel[0] + f.travel[1] * g.travel[1]
    if (Math.acos(Math.max(-1, Math.min(1, cos))) < (o.minTurnDeg * Math.PI) / 180) continue
    const at = intersect(f.line, g.line)
    if (!at) continue
    // The corner must lie ahead of the first face's end and behind the second face's start, within a bridge's reach.
    const endF = pts[indexAt(s, f.to)]
    const startG = pts[indexAt(s, g.from)]
    const ahead = (at[0] - endF[0]) * f.travel[0] + (at[1] - endF[1]) * f.travel[1]
    const behind = (startG[0] - at[0]) * g.travel[0] + (startG[1] - at[1]) * g.travel[1]
    if (ahead < -o.trimMm || behind < -o.trimMm || ahead > o.maxBridgeMm || behind > o.maxBridgeMm) continue
    corners.push({ from: f.to - o.trimMm, to: g.from + o.trimMm, at })
  }
  if (!corners.length) return pts
  const out: Pt[] = []
  let c = 0
  for (let i = 0; i < pts.length; i++) {
    while (c < corners.length && s[i] > corners[c].to) c++
    const corner = corners[c]
    if (corner && s[i] >= corner.from && s[i] <= corner.to) {
      if (out[out.length - 1] !== corner.at) out.push(corner.at)
      continue
    }
    out.push(pts[i])
  }
  return out
}

function indexAt(s: Float64Array, arc: number): number {
  let i = 0
  while (i < s.length - 1 && s[i] < arc) i++
  return i
}
