import { describe, expect, it } from 'vitest'
import {
  COVERAGE_K,
  curvatureSigma,
  extrapolationSigma,
  lineHeightSigma,
  slopeSigma,
  supportHeightSigma,
  touchPointSigma,
} from '../../../shared/geometry/uncertainty'
import { lowerTangentPoint } from '../../../shared/geometry/support-line'
import { geometricFit, signedCurvature } from '../../../shared/geometry/circle-geometric'
import { extrapolateStationLift } from '../../../shared/geometry/heel'
import type { Vec2 } from '../../../shared/geometry/vec'
import { rng } from './helpers'

const std = (v: number[]) => {
  const m = v.reduce((s, x) => s + x, 0) / v.length
  return Math.sqrt(v.reduce((s, x) => s + (x - m) ** 2, 0) / (v.length - 1))
}

function noisyArc(r: number, x0: number, from: number, to: number, sigma: number, seed: number): Vec2[] {
  const { normal } = rng(seed)
  const out: Vec2[] = []
  for (let x = from; x <= to + 1e-9; x += 0.1) out.push([x, r - Math.sqrt(r * r - (x - x0) ** 2) + normal() * sigma])
  return out
}

describe('uncertainty propagation', () => {
  it('moves the touch point by about R·Δh/|BT| for a height error Δh at B (DESIGN §4.7)', () => {
    const circle = { cx: 40, cy: 2000, r: 2000 }
    const moved = lowerTangentPoint([0, 0.01], circle)!
    // Raising B rocks the blade forward: T moves toward B.
    expect(40 - moved[0]).toBeCloseTo((2000 * 0.01) / 40, 2)
    // With only a calibration height error the formula reduces to that law (plus the along error itself).
    const s = touchPointSigma({ edgeSigmaMm: 0, averagingSigmaMm: 0, calibrationSigmaMm: 0.01 }, 2000, 40, 300, 40)
    expect(s).toBeCloseTo(Math.hypot(0.5, 0.01), 9)
  })

  it('tilts L about T: a height error at B changes heights behind T by Δh·(x/|BT| − 1)', () => {
    const circle = { cx: 40, cy: 2000, r: 2000 }
    const t = lowerTangentPoint([0, 0.01], circle)!
    const heightOnNewLine = (x: number) => 0.01 + ((t[1] - 0.01) * x) / t[0]
    expect(Math.abs(heightOnNewLine(200))).toBeCloseTo(lineHeightSigma(0.01, 200, 40), 3)
    expect(supportHeightSigma({ edgeSigmaMm: 0.01, averagingSigmaMm: 0.01, calibrationSigmaMm: 0 }, 400)).toBeCloseTo(Math.hypot(0.01, 0.015 / 20), 12)
  })

  it('predicts the scatter of fitted curvature and slope on noisy 40 mm windows (Monte Carlo)', () => {
    const sigma = 0.01
    const ks: number[] = []
    for (let k = 0; k < 150; k++) ks.push(signedCurvature(geometricFit(noisyArc(2000, 40, 20, 60, sigma, 1 + k)).algebraic))
    const predicted = curvatureSigma(sigma, 401, 40)
    expect(std(ks) / predicted).toBeGreaterThan(0.8)
    expect(std(ks) / predicted).toBeLessThan(1.25)
    expect(slopeSigma(sigma, 401, 40)).toBeCloseTo(sigma * Math.sqrt(12 / 401) / 40, 15)
  })

  it('predicts the scatter of a lift extrapolated 25 mm past a 60 mm fit (Monte Carlo)', () => {
    const sigma = 0.01
    const lifts: number[] = []
    let xs: number[] = []
    for (let k = 0; k < 150; k++) {
      const arc = noisyArc(1500, 40, 130, 190, sigma, 500 + k)
      xs = arc.map((p) => p[0])
      lifts.push(extrapolateStationLift(arc, 190, 215).liftMm!)
    }
    const predicted = extrapolationSigma(sigma, xs, 215)
    expect(std(lifts) / predicted).toBeGreaterThan(0.8)
    expect(std(lifts) / predicted).toBeLessThan(1.25)
  })

  it('reports ± as 2.5 standard uncertainties', () => {
    expect(COVERAGE_K).toBe(2.5)
  })
})
