import { describe, expect, it } from 'vitest'
import { bladeModel } from '../../../shared/geometry/blade-model'
import { bladeToCard, cardToBlade } from '../../../shared/geometry/frames'
import { heightAt, heightLoss, lowestStation, runnerHeights, type RunnerHeightInput } from '../../../shared/geometry/runner-height'
import { COVERAGE_K } from '../../../shared/geometry/uncertainty'
import { interpolateY, type Vec2 } from '../../../shared/geometry/vec'
import { withNoise } from './helpers'

/** A blade model standing tilted on the card (its frame is not the card's), with a straight top edge aboveMm over L. */
function blade(toe: 'left' | 'right' = 'left') {
  const m = bladeModel({ sizeIn: 10, toe, standAlongMm: 150 })
  const top = (from: number, to: number, aboveMm = 26): Vec2[] => {
    const pts: Vec2[] = []
    for (let x = from; x <= to; x += 0.5) pts.push(bladeToCard(m.frame, [x, aboveMm]))
    return pts
  }
  const input = (topCardMm: Vec2[][], edge = m.edgeMm): RunnerHeightInput => ({
    frame: m.frame, bottomCardMm: edge, topCardMm, fromAlongMm: m.truth.rockerStartAlongMm, toAlongMm: m.truth.heelEnd[0],
    bottomSigmaMm: 0.1, topSigmaMm: 0.05, calibrationSigmaMm: 0.02,
  })
  // The true height at x: the top line minus the model's rocker there, both in the true blade frame.
  const rocker = m.bladeMm.filter((q) => q[0] > 4 && q[0] < m.truth.heelEnd[0] + 2)
  const truth = (x: number, aboveMm = 26) => aboveMm - interpolateY(rocker, x)!
  return { m, top, input, truth }
}

describe('runner height at fixed stations', () => {
  for (const toe of ['left', 'right'] as const) {
    it(`reads the top edge minus the running surface every 10 mm where the top edge shows (toe ${toe})`, () => {
      const { top, input, truth } = blade(toe)
      const stations = runnerHeights(input([top(64.2, 131), top(150, 200.5)]))
      // Stations need the top edge over ±2 mm: 70–120 in the first stretch, 160–190 behind the gap, none between.
      expect(stations.map((s) => s.alongMm)).toEqual([70, 80, 90, 100, 110, 120, 160, 170, 180, 190])
      // The model's rocker is known point by point (shared/geometry/blade-model.ts); averaging it over ±1 mm moves
      // its height by a few micrometres (its slope, up to 0.07, times the sampling's offset from the station).
      for (const s of stations) expect(Math.abs(s.heightMm - truth(s.alongMm))).toBeLessThan(0.005)
      expect(stations[0].plusMinusMm).toBeCloseTo(COVERAGE_K * Math.hypot(0.1, 0.05, 0.02), 12)
    })
  }

  it('gives no station where the top edge does not show, and none at all without it', () => {
    const { top, input } = blade()
    expect(runnerHeights(input([]))).toEqual([])
    expect(runnerHeights(input([top(71, 78)]))).toEqual([])
    // A stretch ahead of the rocker start or behind E does not make stations there.
    const { m } = blade()
    const far = runnerHeights(input([top(-20, 3), top(m.truth.heelEnd[0] + 1, m.truth.heelEnd[0] + 30)]))
    expect(far).toEqual([])
  })

  it('bridges a short gap in the traced bottom edge but leaves a station out across a long one', () => {
    const { m, top, input, truth } = blade()
    const along = (p: Vec2) => cardToBlade(m.frame, p)[0]
    const short = m.edgeMm.filter((p) => along(p) < 98.5 || along(p) > 101.5)
    const long = m.edgeMm.filter((p) => along(p) < 95 || along(p) > 105)
    const at100 = (edge: Vec2[]) => runnerHeights(input([top(60, 140)], edge)).find((s) => s.alongMm === 100)
    expect(Math.abs(at100(short)!.heightMm - truth(100))).toBeLessThan(0.005)
    expect(at100(long)).toBeUndefined()
  })

  it('averages noisy edges: 0.02 mm noise on both gives heights within 0.03 mm', () => {
    const { m, top, input, truth } = blade()
    const stations = runnerHeights(input([withNoise(top(60, 180), 0.02, 5)], withNoise(m.edgeMm, 0.02, 6)))
    expect(stations.map((s) => s.alongMm)).toEqual([70, 80, 90, 100, 110, 120, 130, 140, 150, 160, 170])
    // σ of a height: 0.02 mm over 9 top points and 21 bottom points in quadrature ≈ 0.008 mm (computed); 0.03 is ~4σ.
    for (const s of stations) expect(Math.abs(s.heightMm - truth(s.alongMm))).toBeLessThan(0.03)
  })
})

describe('runner height helpers', () => {
  const st = (alongMm: number, heightMm: number, plusMinusMm = 0.3) => ({ alongMm, heightMm, plusMinusMm })

  it('finds the lowest station, and none in an empty profile', () => {
    expect(lowestStation([st(70, 25.1), st(80, 24.9), st(90, 25)])).toEqual(st(80, 24.9))
    expect(lowestStation([])).toBeNull()
  })

  it('lists the height lost at the stations both profiles measured, with the two ± combined', () => {
    const loss = heightLoss([st(70, 25.1), st(80, 24.9), st(90, 25, 0.4)], [st(80, 24.6), st(90, 24.7), st(100, 24)])
    expect(loss.map((l) => l.alongMm)).toEqual([80, 90])
    expect(loss[0].lossMm).toBeCloseTo(0.3, 12)
    expect(loss[1].plusMinusMm).toBeCloseTo(0.5, 12) // √(0.3² + 0.4²), by hand
  })

  it('reads a polyline\u2019s height as the mean over the window, or interpolated across a short gap', () => {
    const line: Vec2[] = [[0, 1], [0.5, 1.5], [1, 2], [10, 11], [10.5, 11.5]]
    expect(heightAt(line, 0.5, 1, 4)).toBeCloseTo(1.5, 12)
    expect(heightAt(line, 5, 1, 4)).toBeNull()
    expect(heightAt(line, 5, 1, 10)).toBeCloseTo(6, 12)
  })
})
