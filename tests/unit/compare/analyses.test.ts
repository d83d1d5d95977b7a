import { describe, expect, it } from 'vitest'
import type { Similarity } from '../../../shared/geometry/registration'
import type { Vec2 } from '../../../shared/geometry/vec'
import { compareAnalyses, metricChanges } from '../../../shared/compare/analyses'
import { resultOf } from '../../factories/analysis-results'

const analysisOf = resultOf

const photo2: Similarity = { scale: 1, rotationRad: (2 * Math.PI) / 180, tx: 15, ty: -4 }

describe('compareAnalyses', () => {
  it('gives the amount a rocker was lowered as steel removed, picks unchanged, across a different photo placement', () => {
    // The amount put in is the reference; 0.1 mm is about one sharpening (REFERENCES.md, from memory).
    const before = analysisOf()
    const after = analysisOf({ removedMm: 0.1, placement: photo2 })
    const cmp = compareAnalyses(before, after)
    const removed = cmp.steelRemoved.map((s) => s.removedMm).filter((v): v is number => v !== null)
    expect(removed.length).toBeGreaterThan(15)
    for (const v of removed) expect(v).toBeCloseTo(0.1, 4)
    expect(cmp.registration.on).toEqual(['toe-pick teeth'])
    expect(cmp.registration.rmsMm).toBeLessThan(1e-3)
  })

  it('finds no steel removed between a blade and itself photographed elsewhere, and overlays the edges', () => {
    const cmp = compareAnalyses(analysisOf(), analysisOf({ placement: photo2 }))
    for (const s of cmp.steelRemoved) if (s.removedMm !== null) expect(Math.abs(s.removedMm)).toBeLessThan(1e-4)
    expect(cmp.overlay.first.length).toBeGreaterThan(200)
    const at = (pts: Vec2[], x: number) => pts.reduce((best, p) => (Math.abs(p[0] - x) < Math.abs(best[0] - x) ? p : best))
    expect(at(cmp.overlay.second, 120)[1]).toBeCloseTo(at(cmp.overlay.first, 120)[1], 1)
  })

  it('compares the left and right blades of a pair in their blade frames (the toe on opposite sides of the card)', () => {
    const left = analysisOf({ model: { sizeIn: 10, toe: 'left' } })
    const right = analysisOf({ model: { sizeIn: 10, toe: 'right' }, removedMm: 0.05 })
    const cmp = compareAnalyses(left, right)
    for (const s of cmp.steelRemoved) if (s.removedMm !== null) expect(s.removedMm).toBeCloseTo(0.05, 4)
  })

  it('says how far noisy edges leave the steel removed when only the teeth hold the registration', () => {
    // 0.01 mm edge noise, about 1/8 px at 12 MP over 320 mm (REFERENCES.md "Photo measurement").
    const cmp = compareAnalyses(analysisOf({ noiseMm: 0.01, seed: 3 }), analysisOf({ removedMm: 0.1, placement: photo2, noiseMm: 0.01, seed: 4 }))
    const errors = cmp.steelRemoved.filter((s) => s.removedMm !== null).map((s) => Math.abs(s.removedMm! - 0.1))
    console.info(`teeth-only registration, 0.01 mm noise: worst steel-removed error ${Math.max(...errors).toFixed(4)} mm`)
    // Measured here: about 0.07 mm at the heel, as large as one sharpening. The teeth span only ~21 mm, so a small
    // rotation error grows along the blade; this bound records that weakness when the top edge does not show.
    expect(Math.max(...errors)).toBeLessThan(0.1)
    expect(errors[0]).toBeLessThan(0.03)
  })
})

describe('metricChanges', () => {
  it('lists each change with the two ± combined, and says when it is inside the noise', () => {
    const a = analysisOf()
    const b = { ...analysisOf({ removedMm: 0.1 }) }
    const changes = metricChanges(a, b)
    const tp = changes.find((c) => c.metric === 'touchPointMm')!
    expect(tp.change).toBeCloseTo(Math.sqrt(2 * 2000 * 0.1), 10) // T moved back by √(2Rd) with R = 2 m (by hand)
    expect(tp.plusMinus).toBeCloseTo(Math.hypot(1.2, 1.2), 12)
    expect(tp.insideNoise).toBe(false)
    const heel = changes.find((c) => c.metric === 'heelLiftMm')!
    expect(heel.change).toBeCloseTo(-0.1, 10)
    expect(heel.insideNoise).toBe(true)
    const mid = changes.find((c) => c.metric === 'middleRadiusMm')!
    expect(mid).toMatchObject({ change: 0, insideNoise: true })
    expect(mid.plusMinus).toBeCloseTo(Math.hypot(66, 66), 9) // 3 % of 2200 mm on each side
  })
})

describe('the ± of the steel removed', () => {
  it('holds the true amount in at least 90 % of stations over 40 noisy comparisons, and widens away from the teeth', () => {
    // Simulation: 0.01 mm edge noise on both edges (edgeResidualMm set to match), 0.1 mm removed by construction.
    let inside = 0
    let total = 0
    for (let seed = 101; seed < 181; seed += 2) {
      const a = { ...resultOf({ noiseMm: 0.01, seed }), quality: { edgeResidualMm: 0.01, sharpness: 1, coverage: 1 } }
      const b = { ...resultOf({ removedMm: 0.1, placement: photo2, noiseMm: 0.01, seed: seed + 1 }), quality: { edgeResidualMm: 0.01, sharpness: 1, coverage: 1 } }
      const cmp = compareAnalyses(a, b)
      const stations = cmp.steelRemoved.filter((s) => s.removedMm !== null)
      expect(stations[stations.length - 1].plusMinusMm!).toBeGreaterThan(stations[0].plusMinusMm!)
      for (const s of stations) {
        total++
        if (Math.abs(s.removedMm! - 0.1) <= s.plusMinusMm!) inside++
      }
    }
    console.info(`steel removed ±: truth inside in ${inside} of ${total} stations`)
    // DESIGN.md §4: the truth lies inside the ± in at least 90 % of cases (measured here: about 95 % of 920).
    expect(inside / total).toBeGreaterThanOrEqual(0.9)
  })
})

describe('comparison response', () => {
  it('matches the API schema, ± included', async () => {
    const { comparisonSchema } = await import('../../../shared/schemas/comparison')
    const { analysisResultSchema } = await import('../../../shared/schemas/analysis')
    analysisResultSchema.parse(resultOf())
    const cmp = compareAnalyses(resultOf(), resultOf({ removedMm: 0.1, placement: photo2 }))
    const dto = comparisonSchema.parse({
      kind: 'any', ...cmp, notes: [],
      first: { analysisId: '00000000-0000-4000-8000-000000000001', bladeId: '00000000-0000-4000-8000-000000000002', side: 'left', takenAt: 'x' },
      second: { analysisId: '00000000-0000-4000-8000-000000000003', bladeId: '00000000-0000-4000-8000-000000000002', side: 'left', takenAt: 'y' },
    })
    expect(dto.steelRemoved.every((s) => s.removedMm === null || (s.plusMinusMm! > 0 && s.insideNoise === false))).toBe(true)
  })
})

describe('registration on the runner\u2019s top edge', () => {
  const noisy = (o: Parameters<typeof resultOf>[0]) => ({ ...resultOf(o), quality: { edgeResidualMm: 0.01, sharpness: 1, coverage: 1 } })

  it('registers on the teeth and the top edge when both results carry it, and holds the tilt far behind the picks', () => {
    // Same noise as the teeth-only case above (0.01 mm); the top edge adds 100 mm of straight steel behind the picks.
    const withTop = compareAnalyses(noisy({ noiseMm: 0.01, seed: 3, topEdgeAboveLMm: 24 }), noisy({ removedMm: 0.1, placement: photo2, noiseMm: 0.01, seed: 4, topEdgeAboveLMm: 24 }))
    const teethOnly = compareAnalyses(noisy({ noiseMm: 0.01, seed: 3 }), noisy({ removedMm: 0.1, placement: photo2, noiseMm: 0.01, seed: 4 }))
    expect(withTop.registration.on).toEqual(['toe-pick teeth', 'runner top edge'])
    expect(teethOnly.registration.on).toEqual(['toe-pick teeth'])
    const worst = (c: typeof withTop) => Math.max(...c.steelRemoved.filter((s) => s.removedMm !== null).map((s) => Math.abs(s.removedMm! - 0.1)))
    console.info(`worst steel-removed error: teeth ${worst(teethOnly).toFixed(4)} mm, teeth and top edge ${worst(withTop).toFixed(4)} mm`)
    expect(worst(withTop)).toBeLessThan(0.02)
    const lastPm = (c: typeof withTop) => c.steelRemoved.filter((s) => s.removedMm !== null).at(-1)!.plusMinusMm!
    expect(lastPm(withTop)).toBeLessThan(lastPm(teethOnly) / 2)
  })

  it('lists the runner height change over the stations both measured, and none when one photo lacks the top edge', () => {
    const changes = metricChanges(resultOf({ topEdgeAboveLMm: 24 }), resultOf({ topEdgeAboveLMm: 24, removedMm: 0.2 }))
    const runner = changes.find((c) => c.metric === 'runnerHeightMm')!
    expect(runner.change).toBeCloseTo(-0.2, 2) // the amount ground off by construction
    expect(runner.insideNoise).toBe(false) // the fixture's ± is 2.5 × √(0.01² + 0.01² + 0.02²) ≈ 0.06 mm a side
    const without = metricChanges(resultOf({ topEdgeAboveLMm: 24 }), resultOf()).find((c) => c.metric === 'runnerHeightMm')!
    expect(without).toMatchObject({ from: null, to: null, change: null })
  })
})
