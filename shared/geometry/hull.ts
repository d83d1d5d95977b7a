import type { Vec2 } from './vec'

/**
 * Lower convex hull (Andrew's monotone chain) of points in a y-up frame: the chain a straight edge laid from below
 * would touch. Returns indices into `points`, ordered by increasing x. Ties in x keep the lower point.
 */
export function lowerHull(points: readonly Vec2[]): number[] {
  const order = points.map((_, i) => i).sort((a, b) => points[a][0] - points[b][0] || points[a][1] - points[b][1])
  const hull: number[] = []
  for (const i of order) {
    while (hull.length >= 2) {
      const o = points[hull[hull.length - 2]]
      const a = points[hull[hull.length - 1]]
      const p = points[i]
      // Pop while o → a → p does not turn counter-clockwise: a then lies on or above the chord o–p.
      if ((a[0] - o[0]) * (p[1] - o[1]) - (a[1] - o[1]) * (p[0] - o[0]) > 0) break
      hull.pop()
    }
    if (hull.length === 0 || points[hull[hull.length - 1]][0] !== points[i][0]) hull.push(i)
  }
  return hull
}
