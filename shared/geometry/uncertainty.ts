import { inverse } from './linalg'

/**
 * Coverage factor applied to every 1σ estimate before it is reported as ±. The σ formulas below match Monte Carlo
 * scatter to within about 10 %; at 2σ a metric whose σ is 10 % low still covers ~93 %, too close to the ≥ 90 % the
 * design asks for, so we report 2.5σ (about 99 % for Gaussian errors of the modelled size).
 */
export const COVERAGE_K = 2.5

/** σ of the height of a fitted arc at its window centre, for n points of noise σ (quadratic fit, uniform sampling). */
export const centreHeightSigma = (sigmaMm: number, n: number): number => (1.5 * sigmaMm) / Math.sqrt(n)

/** σ of the slope of a fitted arc at its window centre over a window of widthMm (uniform sampling). */
export const slopeSigma = (sigmaMm: number, n: number, widthMm: number): number =>
  sigmaMm * Math.sqrt(12 / n) / widthMm

/** σ of the curvature (1/mm) of an arc fitted over widthMm: twice the σ of the quadratic coefficient √(180/n)·σ/W². */
export const curvatureSigma = (sigmaMm: number, n: number, widthMm: number): number =>
  (2 * sigmaMm * Math.sqrt(180 / n)) / (widthMm * widthMm)

/** Noise inputs shared by the uncertainty estimates (all 1σ, mm). */
export interface NoiseModel {
  /** Per-point noise of the traced edge, normal to it. */
  edgeSigmaMm: number
  /**
   * Per-point noise to use where a fit averages many points: edgeSigmaMm·√τ when neighbouring points share their
   * errors (τ from measureEdgeNoise), so a smoothed trace does not look n times better than it is.
   */
  averagingSigmaMm: number
  /** Card calibration residual, taken as a height error between distant parts of the blade. */
  calibrationSigmaMm: number
}

/**
 * σ of the height of B relative to the rocker's tangent circle: B is one extreme edge point (its own noise), the
 * circle's height at T is averaged over its window, and the calibration moves one against the other.
 */
export function supportHeightSigma(noise: NoiseModel, touchWindowCount: number): number {
  const e = noise.edgeSigmaMm
  return Math.hypot(e, centreHeightSigma(noise.averagingSigmaMm, Math.max(touchWindowCount, 1)), noise.calibrationSigmaMm)
}

/**
 * σ of the touch point along L (mm). A height error Δh at B turns L by Δh/|BT| and moves the tangent point by
 * R·Δh/|BT| (DESIGN §4.7); the fitted circle's slope error moves it by R·σslope; the along position itself carries
 * edge and calibration noise.
 */
export function touchPointSigma(
  noise: NoiseModel,
  radiusMm: number,
  touchPointMm: number,
  windowCount: number,
  windowMm: number,
): number {
  const sh = supportHeightSigma(noise, windowCount)
  const r = Number.isFinite(radiusMm) ? radiusMm : 1e5
  return Math.hypot(
    (r * sh) / touchPointMm,
    r * slopeSigma(noise.averagingSigmaMm, Math.max(windowCount, 1), windowMm),
    noise.edgeSigmaMm,
    noise.calibrationSigmaMm,
  )
}

/**
 * σ of a height above L at distance alongMm behind B caused by L itself: L pivots about T when B's height is off,
 * so the error grows as |x/|BT| − 1|.
 */
export const lineHeightSigma = (supportSigma: number, alongMm: number, touchPointMm: number): number =>
  supportSigma * Math.abs(alongMm / touchPointMm - 1)

/**
 * σ of the heel lift at E. Besides L's pivot and E's own noise, E's position along the heel corner depends on the
 * measured direction (chord noise σθ ≈ σ·√2 / 1 mm); it slides σθ/κ along a corner of curvature κ, changing the
 * height by that times sin 45°.
 */
export function heelLiftSigma(noise: NoiseModel, supportSigma: number, heelAlongMm: number, touchPointMm: number, cornerCurvaturePerMm: number): number {
  const sTheta = noise.edgeSigmaMm * Math.SQRT2
  const slide = (sTheta / Math.max(Math.abs(cornerCurvaturePerMm), 0.01)) * Math.SQRT1_2
  return Math.hypot(lineHeightSigma(supportSigma, heelAlongMm, touchPointMm), noise.edgeSigmaMm, noise.calibrationSigmaMm, slide)
}

/**
 * σ of a value extrapolated to stationX from a least-squares quadratic over the window's x values (the circle fit
 * behaves as this parabola to first order): σ·√(vᵀ(XᵀX)⁻¹v), v = (1, d, d²), d = stationX − mean x.
 */
export function extrapolationSigma(sigmaMm: number, xs: readonly number[], stationX: number): number {
  const mx = xs.reduce((s, x) => s + x, 0) / xs.length
  const m = [[0, 0, 0], [0, 0, 0], [0, 0, 0]]
  for (const x of xs) {
    const row = [1, x - mx, (x - mx) ** 2]
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) m[i][j] += row[i] * row[j]
  }
  const inv = inverse(m)
  if (!inv) return Infinity
  const d = stationX - mx
  const v = [1, d, d * d]
  let q = 0
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) q += v[i] * inv[i][j] * v[j]
  return sigmaMm * Math.sqrt(Math.max(q, 0))
}
