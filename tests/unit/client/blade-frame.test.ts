import { describe, expect, it } from 'vitest'
import type { AnalysisResult } from '../../../shared/schemas/analysis'
import { bladeFrameOf } from '../../../src/composables/useBladeFrame'

/** Only the fields the frame reads; B and T 40 mm apart along a line tilted by 3-4-5. */
function resultWith(homography: number[][], toeRight = false): AnalysisResult {
  const b: [number, number] = toeRight ? [300, 150] : [100, 150]
  const dir = toeRight ? -1 : 1
  const t: [number, number] = [b[0] + dir * 32, b[1] + 24]
  return {
    landmarks: {
      basePick: { alongMm: 0, cardMm: b },
      touchPoint: { alongMm: 40, cardMm: t },
      heelEnd: { alongMm: 200, cardMm: [b[0] + dir * 160, b[1] + 100] },
    },
    edge: { cardMm: [], homography },
  } as unknown as AnalysisResult
}

// Homography of a published getPerspectiveTransform example, verified by hand (shared/REFERENCES.md).
const H = [[1, -0.25, 0.25], [0, 1, 0], [0, 0, 1]]

describe('bladeFrameOf', () => {
  it('puts T on the support line at |BT| from B, with the ice side below it', () => {
    for (const toeRight of [false, true]) {
      const f = bladeFrameOf(resultWith(H, toeRight))
      const r = resultWith(H, toeRight)
      const [x, y] = f.toBlade(r.landmarks.touchPoint.cardMm as [number, number])
      expect(x).toBeCloseTo(40, 9) // 3-4-5 triangle: hypot(32, 24) = 40
      expect(y).toBeCloseTo(0, 9)
      // Card y grows toward the ice (DESIGN.md §4), so a point higher on the card is above L: positive blade y.
      const above = f.toBlade([r.landmarks.basePick.cardMm[0], r.landmarks.basePick.cardMm[1] - 10])
      expect(above[1]).toBeGreaterThan(0)
    }
  })

  it('turns a photo position back into mm along L through the inverse homography', () => {
    const f = bladeFrameOf(resultWith(H))
    for (const along of [-20, 0, 37.5, 180]) {
      expect(f.alongFromPhoto(f.toPhoto(f.onLine(along)))).toBeCloseTo(along, 9)
    }
    // H maps (2, 5) to (1, 5) in the published example: check the mapping the overlay draws with.
    expect(bladeFrameOf(resultWith(H)).toPhoto([2, 5])).toEqual([1, 5])
  })
})
