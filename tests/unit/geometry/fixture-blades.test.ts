import { describe, expect, it } from 'vitest'
import { Rng } from '../../../fixtures/synthetic/rng'
import { sampleBladeParams } from '../../../fixtures/synthetic/blade-params'
import { buildBlade } from '../../../fixtures/synthetic/blade'
import { bladeMetrics } from '../../../fixtures/synthetic/blade-truth'
import { measureProfile } from '../../../shared/geometry/measure-profile'
import type { Vec2 } from '../../../shared/geometry/vec'

/**
 * Cross-check against the synthetic-photo generator's blades, built independently of shared/geometry (other pick
 * and gap shapes, a gentle ramp from the gap into the rocker, heel faces of 65–82°), with their own ground truth.
 */
function densify(poly: readonly Vec2[], step: number): Vec2[] {
  const out: Vec2[] = []
  for (let i = 0; i + 1 < poly.length; i++) {
    const [a, b] = [poly[i], poly[i + 1]]
    const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / step))
    for (let k = 0; k < n; k++) out.push([a[0] + ((b[0] - a[0]) * k) / n, a[1] + ((b[1] - a[1]) * k) / n])
  }
  out.push(poly[poly.length - 1])
  return out
}

describe('measureProfile on the photo generator\u2019s blades', () => {
  const rng = new Rng(7)
  const blades = ['freestyle', 'freestyle', 'dance', 'freestyle', 'dance', 'freestyle'].map((d) =>
    buildBlade(sampleBladeParams(rng, d as 'freestyle' | 'dance')),
  )
  it.each(blades.map((b, i) => [i, b] as const))('blade %i agrees with the generator\u2019s truth', (_, blade) => {
    const truth = bladeMetrics(blade)
    // Stand it on a table 0.03 rad off the blade frame, toe right, in card mm (y down).
    const card = densify(blade.bottom, 0.1).map(([x, y]): Vec2 => [300 - (x * Math.cos(0.03) + y * Math.sin(0.03)), 180 + x * Math.sin(0.03) - y * Math.cos(0.03)])
    const r = measureProfile({
      edgeMm: card, toe: 'right', sizeIn: truth.nominalSizeIn, discipline: truth.discipline, edgeSigmaMm: 0.01, calibrationSigmaMm: 0,
    })
    expect(r.touchPointMm).toBeCloseTo(truth.touchPointAlongMm, 2)
    expect(r.heelLiftMm).toBeCloseTo(truth.heelLiftMm, 2)
    expect(r.heelLiftExtrapolated).toBe(truth.heelStation.extrapolated)
    if (truth.heelStation.extrapolated) expect(r.heelLiftStationMm!).toBeCloseTo(truth.heelStation.liftMm, 2)
    expect(r.sectionRadii.toeMm! / truth.sectionRadiiMm.toe).toBeCloseTo(1, 2)
    expect(r.sectionRadii.middleMm! / truth.sectionRadiiMm.middle).toBeCloseTo(1, 2)
    expect(r.sectionRadii.heelMm! / truth.sectionRadiiMm.heel).toBeCloseTo(1, 2)
    expect(r.contactLengthMm).toBeCloseTo(truth.contactLengthMm, 2)
    expect(r.bladeLengthMm).toBeCloseTo(truth.bladeLengthMm, 2)
    expect(r.flatSpots).toEqual([])
    expect(r.kinks).toEqual([])
  })
})
