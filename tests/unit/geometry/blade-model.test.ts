import { describe, expect, it } from 'vitest'
import { bladeModel } from '../../../shared/geometry/blade-model'
import { cardToBlade } from '../../../shared/geometry/frames'
import { inchesToMm } from '../../../shared/geometry/hollow'

describe('synthetic blade model', () => {
  const m = bladeModel({ sizeIn: 10.5 })

  it('rests on L at B and T only: every point at or above y = 0, B = (0, 0), T = (40, 0)', () => {
    expect(Math.min(...m.bladeMm.map((p) => p[1]))).toBeGreaterThan(-1e-9)
    expect(m.bladeMm.some((p) => p[0] === 0 && p[1] === 0)).toBe(true)
    const nearT = m.bladeMm.filter((p) => Math.abs(p[0] - 40) < 0.05)
    expect(Math.min(...nearT.map((p) => p[1]))).toBeLessThan(1e-6)
  })

  it('is as long as its nominal size and puts E where the heel corner passes 45°', () => {
    expect(m.truth.lengthMm).toBeCloseTo(inchesToMm(10.5), 0)
    const i = m.bladeMm.findIndex((p) => p[0] > m.truth.heelEnd[0] && p[1] > m.truth.heelEnd[1])
    const [a, b] = [m.bladeMm[i - 2], m.bladeMm[i + 1]]
    expect((Math.atan2(b[1] - a[1], b[0] - a[0]) * 180) / Math.PI).toBeCloseTo(45, 0)
    expect(m.truth.heelLiftMm).toBe(m.truth.heelEnd[1])
  })

  it('maps its card-frame edge back onto its blade-frame edge, for either toe side', () => {
    for (const toe of ['left', 'right'] as const) {
      const t = bladeModel({ sizeIn: 9, toe })
      const worst = Math.max(...t.edgeMm.map((p, i) => {
        const q = cardToBlade(t.frame, p)
        return Math.hypot(q[0] - t.bladeMm[i][0], q[1] - t.bladeMm[i][1])
      }))
      expect(worst).toBeLessThan(1e-9)
    }
  })

  it('stands on the table at the chosen point: the lowest card point (largest y) is there', () => {
    const lowest = m.edgeMm.reduce((best, p, i) => (p[1] > m.edgeMm[best][1] ? i : best), 0)
    expect(m.bladeMm[lowest][0]).toBeCloseTo(110, 0)
  })

  it('gives a dance tail short of the heel station and a station lift on the continued heel circle', () => {
    const d = bladeModel({ sizeIn: 9.5, tailShortMm: 30 })
    expect(d.truth.heelEnd[0]).toBeLessThan(d.truth.heelStationAlongMm)
    expect(d.truth.heelLiftStationMm).not.toBeNull()
    expect(m.truth.heelLiftStationMm).toBeNull()
  })
})
