import { describe, expect, it } from 'vitest'
import { describeRunnerHeight, runnerHeightSummary } from '../../../shared/wear/runner-height'
import { assessWear } from '../../../shared/wear/state'
import { resultOf } from '../../factories/analysis-results'

// The fixture's runner: a straight top edge 24 mm above L from 70 to 170 mm behind B (stations 80–160), over the
// blade model's rocker (fixtures/measured-result.ts), which rises toward the heel, so the runner is lowest at 160 mm;
// grinding raises the rocker by the amount put in and leaves the top edge.
const photo2 = { scale: 1, rotationRad: (1.5 * Math.PI) / 180, tx: 12, ty: -5 }

describe('runner height over a blade\u2019s history', () => {
  it('gives the height now, at the baseline and the loss at the stations both show', () => {
    const base = resultOf({ topEdgeAboveLMm: 24 })
    const now = resultOf({ topEdgeAboveLMm: 24, removedMm: 0.3, placement: photo2 })
    const s = runnerHeightSummary(base, now)
    expect(s.lossStations.map((l) => l.alongMm)).toEqual([80, 90, 100, 110, 120, 130, 140, 150, 160])
    // 0.3 mm is the amount ground off by construction; the support line tilts by under 0.2° with T, which changes
    // heights at a station by microns.
    for (const l of s.lossStations) expect(Math.abs(l.lossMm - 0.3)).toBeLessThan(0.01)
    expect(s.loss!.meanMm).toBeCloseTo(0.3, 2)
    expect(s.baseline!.alongMm).toBe(160)
    expect(s.latest!.heightMm).toBeCloseTo(s.baseline!.heightMm - 0.3, 2)
    expect(describeRunnerHeight(s, 22)).toMatch(/^Runner height: \d\d\.\d\d ± \d\.\d\d mm at its lowest station \(160 mm behind the base pick\)\. Lost since the baseline: 0\.30 ± /)
  })

  it('says so when the latest photo does not show the top edge, and has no loss without a baseline', () => {
    const hidden = runnerHeightSummary(resultOf({ topEdgeAboveLMm: 24 }), resultOf())
    expect(hidden).toMatchObject({ latest: null, lossStations: [], loss: null })
    expect(describeRunnerHeight(hidden, null)).toBe("Runner height: the runner's top edge did not show in the latest photo, so it was not measured. No shop minimum set.")
    expect(describeRunnerHeight(hidden, 22.5, 'Glenmere Edge Works')).toMatch(/The shop's minimum is 22\.5 mm \(Glenmere Edge Works\)\.$/)
    const alone = resultOf({ topEdgeAboveLMm: 24 })
    const first = runnerHeightSummary(alone, alone)
    expect(first.loss).toBeNull()
    expect(first.latest).toEqual(first.baseline)
  })

  it('feeds the wear rule: a runner worn to the shop minimum is to be replaced even with the rocker on target', () => {
    const s = runnerHeightSummary(resultOf({ topEdgeAboveLMm: 24 }), resultOf({ topEdgeAboveLMm: 24, removedMm: 1 }))
    const wear = (min: number) => assessWear({
      rockerStatuses: ['on target', 'on target'], runnerHeightMm: s.latest!.heightMm, baselineRunnerHeightMm: s.baseline!.heightMm,
      steelRemovedMm: s.lossStations.map((l) => l.lossMm), minRunnerHeightMm: min,
    })
    expect(wear(s.latest!.heightMm + 0.05).state).toBe('replace')
    expect(wear(s.latest!.heightMm - 0.05).state).toBeNull()
    expect(wear(s.latest!.heightMm - 0.05).heightAfterRestoreMm).toBeCloseTo(s.baseline!.heightMm - 1, 2)
  })
})
