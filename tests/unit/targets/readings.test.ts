import { describe, expect, it } from 'vitest'
import type { AnalysisResult } from '../../../shared/schemas/analysis'
import { describeReading, readAnalysis, readPair, readRootRadius } from '../../../shared/targets/readings'
import { resolveTargets } from '../../../shared/targets/resolve'

/** The fields a reading uses; the rest of an analysis result is irrelevant here. */
function result(over: Partial<AnalysisResult> & { pm?: Partial<AnalysisResult['uncertainty']> }): AnalysisResult {
  const { pm, ...rest } = over
  return {
    touchPointMm: 40,
    heelLiftMm: 25,
    heelLiftStationMm: null,
    heelLiftExtrapolated: false,
    contactLengthMm: 3,
    uncertainty: { touchPointMm: 1.5, heelLiftMm: 0.5, heelLiftStationMm: null, contactLengthMm: 0.2, radiusRelative: 0.02, ...pm },
    ...rest,
  } as AnalysisResult
}

const targets = resolveTargets({ blade: { sizeIn: 9.5 } })

describe('readAnalysis', () => {
  it('reads touch point, heel lift and contact length against the resolved bands with their ±', () => {
    const [tp, hl, cl] = readAnalysis(result({ touchPointMm: 44, contactLengthMm: 6 }), targets)
    expect(tp).toMatchObject({ metric: 'touchPointMm', status: 'near limit', plusMinus: 1.5, layer: 'platform' })
    expect(hl).toMatchObject({ metric: 'heelLiftMm', value: 25, status: 'on target', remarks: [] })
    expect(cl).toMatchObject({ metric: 'contactLengthMm', status: 'off target' })
  })
  it('reads the heel lift at the heel station when the heel end falls short of it (dance blades)', () => {
    const r = result({ heelLiftMm: 9, heelLiftStationMm: 16, heelLiftExtrapolated: true, pm: { heelLiftStationMm: 2 } })
    const hl = readAnalysis(r, targets)[1]
    expect(hl).toMatchObject({ value: 16, plusMinus: 2, status: 'near limit' })
    expect(hl.remarks[0]).toContain('extrapolated')
  })
  it('says it in one line', () => {
    const tp = readAnalysis(result({ touchPointMm: 41.23 }), targets)[0]
    expect(describeReading(tp)).toBe('Touch point 41.2 ± 1.5 mm, target 35–45 mm: on target')
  })
})

describe('readPair', () => {
  it('reads |left − right| with the two ± combined in quadrature', () => {
    const left = result({ touchPointMm: 40, heelLiftMm: 25, pm: { touchPointMm: 0.3, heelLiftMm: 0.4 } })
    const right = result({ touchPointMm: 44, heelLiftMm: 24, pm: { touchPointMm: 0.4, heelLiftMm: 0.3 } })
    const [tp, hl] = readPair(left, right, targets)
    expect(tp.value).toBeCloseTo(4, 12)
    expect(tp.plusMinus).toBeCloseTo(0.5, 12) // 3-4-5 triangle
    expect(tp.status).toBe('off target') // 1 mm past a 3 mm limit, more than 10 % of 3 mm
    expect(hl.value).toBeCloseTo(1, 12)
    expect(hl.status).toBe('on target')
  })
})

describe('readRootRadius', () => {
  it('flags a hockey grind on the reading (common practice, no published source)', () => {
    expect(readRootRadius(7, targets)).toMatchObject({ status: 'on target', remarks: [] })
    const hockey = readRootRadius(10, targets)
    expect(hockey.status).toBe('off target')
    expect(hockey.remarks[0]).toContain('hockey')
    expect(describeReading(hockey)).toBe('Root radius 10/16 in, target 5/16–8/16 in: off target')
  })
})
