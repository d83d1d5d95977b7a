import { describe, expect, it } from 'vitest'
import { analysisRefusalSchema, analysisResultSchema } from '../../../shared/schemas/analysis'

const landmark = (alongMm: number, x: number) => ({ alongMm, cardMm: [x, 150] as [number, number] })

function sampleAnalysis() {
  return {
    algorithmVersion: 'profile-1',
    touchPointMm: 40.2,
    heelLiftMm: 22.5,
    heelLiftStationMm: null,
    heelLiftExtrapolated: false,
    contactLengthMm: 5.5,
    bladeLengthMm: 253.8,
    uncertainty: { touchPointMm: 1.1, heelLiftMm: 0.3, heelLiftStationMm: null, contactLengthMm: 0.1, radiusRelative: 0.03 },
    radiusProfile: [{ alongMm: 60, curvaturePerMm: 4.4e-4, radiusMm: 2272 }, { alongMm: 65, curvaturePerMm: 0, radiusMm: null }],
    sectionRadii: { toeMm: 1500, middleMm: 2200, heelMm: null },
    flatSpots: [{ fromAlongMm: 90, toAlongMm: 104, radiusMm: null }],
    kinks: [{ alongMm: 120, angleDeg: -1.4 }],
    landmarks: { basePick: landmark(0, 40), touchPoint: landmark(40.2, 80), heelEnd: landmark(230, 270) },
    edge: { cardMm: [[40, 150], [41, 150.1]], homography: [[10, 0, 5], [0, 10, 7], [0, 0, 1]] },
    card: { cardId: 'RB-0001', residualMm: 0.05, residualPx: 0.6, checkBarMm: 100 },
    quality: { edgeResidualMm: 0.01, sharpness: 3.2, coverage: 0.98 },
    warnings: [{ code: 'LENGTH_MISMATCH', message: 'The blade measures 4 % longer than its nominal size.' }],
    overrides: null,
  }
}

describe('analysis result schema', () => {
  it('accepts a complete result', () => {
    expect(analysisResultSchema.parse(sampleAnalysis()).touchPointMm).toBe(40.2)
  })
  it('rejects a homography that is not 3×3 and a coverage above 1', () => {
    const bad = sampleAnalysis()
    bad.edge.homography = [[1, 0], [0, 1]] as never
    expect(analysisResultSchema.safeParse(bad).success).toBe(false)
    const bad2 = sampleAnalysis()
    bad2.quality.coverage = 1.2
    const res = analysisResultSchema.safeParse(bad2)
    expect(res.success).toBe(false)
    expect(res.error?.issues[0].path).toEqual(['quality', 'coverage'])
  })
  it('accepts overrides and refuses a negative ±', () => {
    const withOverrides = { ...sampleAnalysis(), overrides: { heelEndAlongMm: 228 } }
    expect(analysisResultSchema.parse(withOverrides).overrides).toEqual({ heelEndAlongMm: 228 })
    const bad = sampleAnalysis()
    bad.uncertainty.touchPointMm = -1
    expect(analysisResultSchema.safeParse(bad).success).toBe(false)
  })
})

describe('refusal schema', () => {
  it('accepts the five codes only', () => {
    expect(analysisRefusalSchema.parse({ code: 'BLADE_CUT_OFF', message: 'The heel is outside the photo.' }).code).toBe('BLADE_CUT_OFF')
    expect(analysisRefusalSchema.safeParse({ code: 'OTHER', message: 'x' }).success).toBe(false)
  })
})
