import { describe, expect, it } from 'vitest'
import { levenbergMarquardt } from 'ml-levenberg-marquardt'
import {
  algebraicDistance,
  circleRms,
  kasaFit,
  prattAlgebraic,
  prattFit,
  taubinFit,
  unitNormAlgebraicFit,
} from '../../../shared/geometry/circle-fit'
import { geometricFit, signedCurvature, trimmedGeometricFit } from '../../../shared/geometry/circle-geometric'
import type { Vec2 } from '../../../shared/geometry/vec'

// Worked example of Gander, Golub & Strebel, "Least-squares fitting of circles and ellipses", BIT 34 (1994) 558–578.
const GGS: Vec2[] = [[1, 7], [2, 6], [5, 8], [7, 7], [9, 5], [3, 7]]

function expectCircle(c: { cx: number; cy: number; r: number }, cx: number, cy: number, r: number) {
  expect(c.cx).toBeCloseTo(cx, 4)
  expect(c.cy).toBeCloseTo(cy, 4)
  expect(c.r).toBeCloseTo(r, 4)
}

describe('algebraic circle fits on the Gander–Golub–Strebel example', () => {
  it('Kåsa gives (4.7423, 3.8351), r 4.1088', () => {
    // REFERENCES.md: computed (not from the paper).
    expectCircle(kasaFit(GGS), 4.7423, 3.8351, 4.1088)
  })
  it('Pratt gives (4.6155, 2.8074), r 4.9113', () => {
    // REFERENCES.md: computed.
    expectCircle(prattFit(GGS), 4.6155, 2.8074, 4.9113)
  })
  it('Taubin gives (4.6139, 2.7952), r 4.8792', () => {
    // REFERENCES.md: computed.
    expectCircle(taubinFit(GGS), 4.6139, 2.7952, 4.8792)
  })
  it('the ‖u‖ = 1 algebraic fit gives (5.3794, 7.2532), r 3.0370', () => {
    // Gander, Golub & Strebel 1994 (values quoted from memory in REFERENCES.md, reproduced).
    expectCircle(unitNormAlgebraicFit(GGS), 5.3794, 7.2532, 3.037)
  })
  it('keeps B² + C² − 4AD = 1 so the distance formula is metric', () => {
    const u = prattAlgebraic(GGS)
    expect(u.b * u.b + u.c * u.c - 4 * u.a * u.d).toBeCloseTo(1, 12)
    const c = prattFit(GGS)
    const p: Vec2 = [c.cx + c.r + 0.5, c.cy]
    expect(algebraicDistance(u, p)).toBeCloseTo(0.5, 10)
  })
  it('rejects fewer than three points and collinear points for Kåsa', () => {
    expect(() => prattFit([[0, 0], [1, 1]])).toThrow(RangeError)
    expect(() => kasaFit([[0, 0], [1, 1], [2, 2]])).toThrow(RangeError)
  })
})

describe('geometric circle fit', () => {
  it('reproduces the paper\u2019s geometric fit: (4.7398, 2.9835), r 4.7142, RSS 1.2276', () => {
    // Gander, Golub & Strebel 1994, geometric fit (REFERENCES.md, from memory, reproduced by independent solvers).
    const fit = geometricFit(GGS)
    expectCircle(fit.circle, 4.7398, 2.9835, 4.7142)
    expect(fit.rms ** 2 * GGS.length).toBeCloseTo(1.2276, 4)
    expect(circleRms(fit.circle, GGS)).toBeCloseTo(fit.rms, 10)
  })

  it('agrees with ml-levenberg-marquardt as an independent solver', () => {
    // General-purpose LM (REFERENCES.md: reproduces the geometric fit to 5 digits). Residual |p − c| − r as a
    // function of the point index, target 0.
    const idx = GGS.map((_, i) => i)
    const model = ([cx, cy, r]: number[]) => (i: number) => Math.hypot(GGS[i][0] - cx, GGS[i][1] - cy) - r
    const start = kasaFit(GGS)
    const ref = levenbergMarquardt({ x: idx, y: idx.map(() => 0) }, model, {
      initialValues: [start.cx, start.cy, start.r],
      maxIterations: 500,
      errorTolerance: 1e-12,
      damping: 1e-3,
      gradientDifference: 1e-6,
      centralDifference: true,
    })
    const [cx, cy, r] = ref.parameterValues
    expect(cx).toBeCloseTo(4.7398, 3)
    expect(cy).toBeCloseTo(2.9835, 3)
    expect(r).toBeCloseTo(4.7142, 3)
    const ours = geometricFit(GGS).circle
    expect(Math.abs(ours.cx - cx) + Math.abs(ours.cy - cy) + Math.abs(ours.r - r)).toBeLessThan(1e-3)
  })

  it('recovers a 2 m arc over a 40 mm window, where the centre is 2000 mm away', () => {
    const arc: Vec2[] = []
    for (let x = -20; x <= 20; x += 0.1) arc.push([x + 100, 2005 - Math.sqrt(2000 ** 2 - x * x)])
    const fit = geometricFit(arc)
    expect(fit.circle.r).toBeCloseTo(2000, 3)
    expect(fit.circle.cx).toBeCloseTo(100, 3)
    expect(signedCurvature(fit.algebraic)).toBeCloseTo(1 / 2000, 9)
  })

  it('fits a straight line with zero curvature instead of diverging', () => {
    const line: Vec2[] = []
    for (let x = 0; x <= 40; x += 0.2) line.push([x, 3 + 0.01 * x])
    const fit = geometricFit(line)
    expect(fit.curvature).toBeLessThan(1e-9)
    expect(fit.rms).toBeLessThan(1e-9)
  })

  it('gives negative signed curvature to an arc bulging upward', () => {
    const arc: Vec2[] = []
    for (let x = -20; x <= 20; x += 0.5) arc.push([x, Math.sqrt(500 ** 2 - x * x) - 500])
    expect(signedCurvature(geometricFit(arc).algebraic)).toBeCloseTo(-1 / 500, 8)
  })

  it('stays unbiased on a noisy short arc where Kåsa shrinks the radius', () => {
    let seed = 7
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5
    const arc: Vec2[] = []
    for (let t = -0.3; t <= 0.3; t += 0.003) arc.push([50 * Math.sin(t) + rnd() * 0.2, 50 - 50 * Math.cos(t) + rnd() * 0.2])
    expect(Math.abs(geometricFit(arc).circle.r - 50)).toBeLessThan(1.5)
    expect(kasaFit(arc).r).toBeLessThan(geometricFit(arc).circle.r)
  })

  it('sets a speck in the trace aside in the trimmed fit', () => {
    let seed = 11
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5
    const arc: Vec2[] = []
    for (let x = -20; x <= 20; x += 0.1) arc.push([x, 2000 - Math.sqrt(2000 ** 2 - x * x) + rnd() * 0.03])
    const specked = arc.map((p, i): Vec2 => (i > 250 && i < 262 ? [p[0], p[1] + 0.8] : p))
    expect(Math.abs(geometricFit(specked).circle.r / 2000 - 1)).toBeGreaterThan(0.2)
    const trimmed = trimmedGeometricFit(specked)
    expect(trimmed.kept).toBeLessThanOrEqual(arc.length - 11)
    expect(Math.abs(trimmed.circle.r / 2000 - 1)).toBeLessThan(0.05)
    expect(trimmedGeometricFit(arc).kept).toBeGreaterThan(arc.length - 3)
  })
})
