import { dist } from '../../shared/geometry/vec'

type Pt = [number, number]

/** Arc length from the first point to each point. */
export function cumulative(pts: Pt[]): Float64Array {
  const s = new Float64Array(pts.length)
  for (let i = 1; i < pts.length; i++) s[i] = s[i - 1] + Math.hypot(pts[i][0] - pts[i - 1][0], pts[i][1] - pts[i - 1][1])
  return s
}

/** Distance of p from the line through a and b, extended past them (from a when a = b). */
function chordDistance(p: Pt, a: Pt, b: Pt): number {
  const len = Math.hypot(b[0] - a[0], b[1] - a[1])
  if (len === 0) return Math.hypot(p[0] - a[0], p[1] - a[1])
  return Math.abs((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])) / len
}

/**
 * Drops isolated outliers. A point's bend is its distance from the line through the points up to `halfMm` before it,
 * or from the line through those after it, whichever is nearer: a spike is far from both, while a point on a tooth's
 * face next to a sharp corner lies on one of them. A point is kept when its bend is not far beyond what its own
 * neighbourhood shows.
 */
export function dropOutliers(pts: Pt[], halfMm: number, floorMm: number): Pt[] {
  const s = cumulative(pts)
  const bend = new Float64Array(pts.length)
  let lo = 0
  let hi = 0
  for (let i = 0; i < pts.length; i++) {
    while (s[i] - s[lo] > halfMm) lo++
    while (hi < pts.length - 1 && s[hi] - s[i] < halfMm) hi++
    const before = lo < i - 1 ? chordDistance(pts[i], pts[lo], pts[i - 1]) : Infinity
    const after = hi > i + 1 ? chordDistance(pts[i], pts[i + 1], pts[hi]) : Infinity
    bend[i] = Number.isFinite(Math.min(before, after)) ? Math.min(before, after) : 0
  }
  const keep: Pt[] = []
  const near: number[] = []
  for (let i = 0; i < pts.length; i++) {
    near.length = 0
    for (let k = i - 1; k >= 0 && s[i] - s[k] < 4 * halfMm; k--) near.push(bend[k])
    for (let k = i + 1; k < pts.length && s[k] - s[i] < 4 * halfMm; k++) near.push(bend[k])
    near.sort((a, b) => a - b)
    const typical = near.length ? near[Math.floor(near.length / 2)] : 0
    if (bend[i] <= 3 * typical + floorMm) keep.push(pts[i])
  }
  return keep
}

/**
 * Starts the edge at the first toe-pick tip: the first point, walking from the toe, below which the edge later rises
 * by `riseMm` (card frame, y down). The blade's front face above it is not part of the bottom edge.
 */
export function startAtFirstTip(pts: Pt[], riseMm: number, withinMm: number): Pt[] {
  let lowest = 0
  const s = cumulative(pts)
  for (let i = 1; i < pts.length && s[i] < withinMm; i++) {
    if (pts[i][1] > pts[lowest][1]) lowest = i
    else if (pts[lowest][1] - pts[i][1] >= riseMm) return pts.slice(lowest)
  }
  return pts
}

/**
 * Drops short runs of points cut off from the rest by jumps over `jumpMm`: strays a search found on another face.
 * A run counts by its arc length, `minRunMm`: a toe-pick face between a dropped notch and a dropped tip is a short
 * run of few points, yet it is what the base pick is rebuilt from.
 */
export function dropStrayRuns(pts: Pt[], jumpMm: number, minRunMm: number): Pt[] {
  // A lone stray between two close neighbours would cut their run in two; it goes first, so the run holds.
  const joined = pts.filter((p, i) => !(i > 0 && i + 1 < pts.length && dist(pts[i - 1], p) > jumpMm && dist(p, pts[i + 1]) > jumpMm &&
    dist(pts[i - 1], pts[i + 1]) <= jumpMm))
  const runs: Pt[][] = [[]]
  joined.forEach((p, i) => {
    if (i > 0 && dist(p, joined[i - 1]) > jumpMm) runs.push([])
    runs[runs.length - 1].push(p)
  })
  return runs.filter((r) => r.length >= 3 && cumulative(r)[r.length - 1] >= minRunMm).flat()
}
