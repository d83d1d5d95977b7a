import { bladeFrameFromCard, bladeToCard, cardToBlade } from '../../shared/geometry/frames'
import { applyHomography, invertHomography } from '../../shared/geometry/homography'
import type { AnalysisResult } from '../../shared/schemas/analysis'

type Pt = [number, number]

/**
 * The analysis's blade frame (DESIGN.md §4: origin at the base pick B, x along the support line toward the heel, y
 * up, mm) and the photo mapping, for drawing the overlay and turning a drag on the photo into an `alongMm`.
 */
export function bladeFrameOf(result: AnalysisResult) {
  const frame = bladeFrameFromCard(result.landmarks.basePick.cardMm, result.landmarks.touchPoint.cardMm)
  const toPhoto = result.edge.homography
  const fromPhoto = invertHomography(toPhoto)
  return {
    toBlade: (p: Pt) => cardToBlade(frame, p) as Pt,
    toPhoto: (p: Pt) => applyHomography(toPhoto, p) as Pt,
    /** Photo px → mm along L from the current B. */
    alongFromPhoto: (px: Pt) => cardToBlade(frame, applyHomography(fromPhoto, px))[0],
    /** A point on L at `alongMm` from B, card mm. */
    onLine: (alongMm: number) => bladeToCard(frame, [alongMm, 0]) as Pt,
  }
}
