import type { EdgeMark } from './heel'
import type { Support } from './landmarks'
import type { WindowFit } from './radius-profile'
import { PROFILE_WINDOW_MM } from './radius-profile'
import type { NoiseModel } from './uncertainty'
import {
  COVERAGE_K,
  curvatureSigma,
  extrapolationSigma,
  heelLiftSigma,
  lineHeightSigma,
  supportHeightSigma,
  touchPointSigma,
} from './uncertainty'
import type { Vec2 } from './vec'
import { median } from './vec'

export interface UncertaintyContext {
  noise: NoiseModel
  support: Support
  profile: readonly WindowFit[]
  heel: EdgeMark
  angles: Float64Array
  blade: readonly Vec2[]
  station: { liftMm: number | null; xs: number[]; stationX: number }
  radiusT: number
}

/** ± (COVERAGE_K σ) of each metric of one measurement; relative radius ± as fractions. */
export interface ProfileUncertainty {
  touchPointMm: number
  heelLiftMm: number
  heelLiftStationMm: number | null
  radiusRelative: number
  radiusRelativeAtTouch: number
}

/** Curvature of the heel corner at E (1/mm), from the change of direction over about ±0.5 mm of edge. */
function cornerCurvature(blade: readonly Vec2[], angles: Float64Array, at: number): number {
  let lo = at
  let hi = at
  while (lo > 0 && Math.hypot(blade[at][0] - blade[lo][0], blade[at][1] - blade[lo][1]) < 0.5) lo--
  while (hi < blade.length - 1 && Math.hypot(blade[hi][0] - blade[at][0], blade[hi][1] - blade[at][1]) < 0.5) hi++
  const arc = Math.hypot(blade[hi][0] - blade[lo][0], blade[hi][1] - blade[lo][1])
  return arc > 0 ? (angles[hi] - angles[lo]) / arc : 0
}

/** Relative 1σ of a window's radius: σκ / |κ|; Infinity for a straight window. */
function relativeRadiusSigma(sigmaMm: number, w: WindowFit): number {
  return w.radiusMm === null ? Infinity : curvatureSigma(sigmaMm, w.count, PROFILE_WINDOW_MM) / Math.abs(w.curvaturePerMm)
}

/**
 * Propagates edge noise and calibration residual to each metric (DESIGN §4.7): the touch point through
 * R·Δh/|BT|, heights through L's pivot about T, the station lift through the extrapolation of its fitted arc.
 */
export function measureUncertainty(c: UncertaintyContext): ProfileUncertainty {
  const { noise, support, heel } = c
  const bt = support.touchPointMm
  const nT = Math.max(support.touchWindowCount, 1)
  const sh = supportHeightSigma(noise, nT)
  const touch = touchPointSigma(noise, c.radiusT, bt, nT, PROFILE_WINDOW_MM)
  const lift = heelLiftSigma(noise, sh, heel.point[0], bt, cornerCurvature(c.blade, c.angles, heel.index))
  const stationSigma =
    c.station.liftMm === null
      ? null
      : Math.hypot(lineHeightSigma(sh, c.station.stationX, bt), extrapolationSigma(noise.averagingSigmaMm, c.station.xs, c.station.stationX))
  const rels = c.profile.map((w) => relativeRadiusSigma(noise.averagingSigmaMm, w)).filter(Number.isFinite)
  const relT = Number.isFinite(c.radiusT) ? curvatureSigma(noise.averagingSigmaMm, nT, PROFILE_WINDOW_MM) * c.radiusT : 1
  return {
    touchPointMm: COVERAGE_K * touch,
    heelLiftMm: COVERAGE_K * lift,
    heelLiftStationMm: stationSigma === null ? null : COVERAGE_K * stationSigma,
    radiusRelative: COVERAGE_K * (rels.length ? median(rels) : relT),
    radiusRelativeAtTouch: COVERAGE_K * relT,
  }
}
