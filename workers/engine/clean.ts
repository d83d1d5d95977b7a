type Pt = [number, number]

function cumulative(pts: Pt[]): Float64Array {
  const s = new Float64Array(pts.length)
  for (let i = 1; i < pts.length; i++) s[i] = s[i - 1] + Math.hypot(pts[i][0] - pts[i - 1][0], pts[i][1] - pts[i - 1][1])
  return s
}

/** Distance of p from the chord a–b (0 when a = b). */
function chordDistance(p: Pt, a: Pt, b: Pt): number {
  const len = Math.hypot(b[0] - a[0], b[1] - a[1])
  if (len === 0) return Math.hypot(p[0] - a[0], p[1] - a[1])
  return Math.abs((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])) / len
}

/**
 * Drops isolated outliers: a point is kept when its distance from the chord of its neighbours about `halfMm` away
 * is not far beyond what its own neighbourhood shows (so corners, where every point bends, survive).
 */
export function dropOutliers(pts: Pt[], halfMm: number, floorMm: number): Pt[] {
  const s = cumulative(pts)
  const bend = new Float64Array(pts.length)
  let lo = 0
  let hi = 0
  for (let i = 0; i < pts.length; i++) {
    while (s[i] - s[lo] > halfMm) lo++
    while (hi < pts.length - 1 && s[hi] - s[i] < halfMm) hi++
    bend[i] = lo < i && hi > i ? chordDistance(pts[i], pts[lo], pts[hi]) : 0
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

function fitLine(pts: Pt[]): { p: Pt; d: Pt } | null {
  if (pts.length < 3) return null
  let mx = 0
  let my = 0
  for (const [x, y] of pts) {
    mx += x / pts.length
    my += y / pts.length
  }
  let sxx = 0
  let sxy = 0
  let syy = 0
  for (const [x, y] of pts) {
    sxx += (x - mx) ** 2
    sxy += (x - mx) * (y - my)
    syy += (y - my) ** 2
  }
  const theta = 0.5 * Math.atan2(2 * sxy, sxx - syy)
  return { p: [mx, my], d: [Math.cos(theta), Math.sin(theta)] }
}

function intersect(a: { p: Pt; d: Pt }, b: { p: Pt; d: Pt }): Pt | null {
  const det = a.d[0] * b.d[1] - a.d[1] * b.d[0]
  if (Math.abs(det) < Math.sin((35 * Math.PI) / 180)) return null
  const t = ((b.p[0] - a.p[0]) * b.d[1] - (b.p[1] - a.p[1]) * b.d[0]) / det
  return [a.p[0] + a.d[0] * t, a.p[1] + a.d[1] * t]
}

/**
 * Restores sharp corners that blur rounds off — the toe picks' tips and notches — by intersecting lines fitted to
 * the two straight faces on either side (from `gapMm` to `reachMm` of arc length away from the corner), like a
 * marker corner. Only corners turning more than 35° within `reachMm` inside the first `zoneMm` of the edge.
 */
export function sharpenCorners(pts: Pt[], zoneMm: number, gapMm: number, reachMm: number): Pt[] {
  const s = cumulative(pts)
  const out: Pt[] = []
  let i = 0
  while (i < pts.length) {
    const corner = s[i] < zoneMm ? cornerAt(pts, s, i, gapMm, reachMm) : null
    if (!corner) {
      out.push(pts[i++])
      continue
    }
    // Replace the rounded stretch around the corner by the corner itself.
    while (out.length && s[i] - cumulativeOf(out, pts, s) < gapMm) out.pop()
    out.push(corner.point)
    i = corner.resumeAt
  }
  return out
}

function cumulativeOf(out: Pt[], pts: Pt[], s: Float64Array): number {
  const last = out[out.length - 1]
  const k = pts.indexOf(last)
  return k >= 0 ? s[k] : -Infinity
}

function cornerAt(pts: Pt[], s: Float64Array, i: number, gapMm: number, reachMm: number): { point: Pt; resumeAt: number } | null {
  const before = pts.filter((_, k) => s[i] - s[k] >= gapMm && s[i] - s[k] <= reachMm)
  const after = pts.filter((_, k) => s[k] - s[i] >= gapMm && s[k] - s[i] <= reachMm)
  const a = fitLine(before)
  const b = fitLine(after)
  if (!a || !b || before.length < 4 || after.length < 4) return null
  const p = intersect(a, b)
  if (!p || Math.hypot(p[0] - pts[i][0], p[1] - pts[i][1]) > gapMm) return null
  // Only where this point is the nearest to the intersection among its rounded neighbours.
  for (let k = i - 1; k >= 0 && s[i] - s[k] < gapMm; k--) if (Math.hypot(p[0] - pts[k][0], p[1] - pts[k][1]) < Math.hypot(p[0] - pts[i][0], p[1] - pts[i][1])) return null
  let j = i + 1
  while (j < pts.length && s[j] - s[i] < gapMm) {
    if (Math.hypot(p[0] - pts[j][0], p[1] - pts[j][1]) < Math.hypot(p[0] - pts[i][0], p[1] - pts[i][1])) return null
    j++
  }
  return { point: p, resumeAt: j }
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

/** Drops short runs of points cut off from the rest by jumps over `jumpMm`: strays a search found on another face. */
export function dropStrayRuns(pts: Pt[], jumpMm: number, minRun: number): Pt[] {
  const runs: Pt[][] = [[]]
  pts.forEach((p, i) => {
    if (i > 0 && Math.hypot(p[0] - pts[i - 1][0], p[1] - pts[i - 1][1]) > jumpMm) runs.push([])
    runs[runs.length - 1].push(p)
  })
  return runs.filter((r) => r.length >= minRun).flat()
}
