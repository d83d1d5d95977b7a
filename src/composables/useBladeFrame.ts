import { applyHomography, invertHomography } from '../../shared/geometry/homography'
import type { AnalysisResult } from '../../shared/schemas/analysis'

type Pt = [number, number]

/**
 * The analysis's blade frame (DESIGN.md §4: origin at the base pick B, x along the support line toward the heel, y
 * up, mm) and the photo mapping, for drawing the overlay and turning a drag on the photo into an `alongMm`.
 */
export function bladeFrameOf(result: AnalysisResult) {
  const b = result.landmarks.basePick.cardMm as Pt
  const t = result.landmarks.touchPoint.cardMm as Pt
  const len = Math.hypot(t[0] - b[0], t[1] - b[1]) || 1
  const u: Pt = [(t[0] - b[0]) / len, (t[1] - b[1]) / len]
  // Card y points down, toward the ice: the normal with positive card y points down, blade y is its opposite.
  const n: Pt = u[0] >= 0 ? [-u[1], u[0]] : [u[1], -u[0]]
  const down: Pt = n[1] >= 0 ? n : [-n[0], -n[1]]
  const toPhoto = result.edge.homography
  const fromPhoto = invertHomography(toPhoto)
  return {
    toBlade(p: Pt): Pt {
      const d: Pt = [p[0] - b[0], p[1] - b[1]]
      return [d[0] * u[0] + d[1] * u[1], -(d[0] * down[0] + d[1] * down[1])]
    },
    toPhoto: (p: Pt) => applyHomography(toPhoto, p) as Pt,
    /** Photo px → mm along L from the current B. */
    alongFromPhoto(px: Pt): number {
      const c = applyHomography(fromPhoto, px)
      return (c[0] - b[0]) * u[0] + (c[1] - b[1]) * u[1]
    },
    /** A point on L at `alongMm` from B, card mm. */
    onLine: (alongMm: number): Pt => [b[0] + u[0] * alongMm, b[1] + u[1] * alongMm],
  }
}
