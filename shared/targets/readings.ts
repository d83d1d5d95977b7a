import type { AnalysisResult } from '../schemas/analysis'
import { METRIC_INFO, formatBand, formatValue, isHockeyGrind, type Band, type TargetMetric } from './bands'
import { readAgainstTarget, type TargetStatus } from './read'
import type { ResolvedTargets, TargetLayer } from './resolve'

/** One metric read against its target, ready for a page or a report. Values in the metric's unit. */
export interface MetricReading {
  metric: TargetMetric
  label: string
  unit: string
  decimals: number
  value: number
  plusMinus: number
  band: Band
  layer: TargetLayer
  status: TargetStatus
  /** Extra facts people need to read the number, e.g. "read at the heel station (extrapolated)". */
  remarks: string[]
}

function reading(
  metric: TargetMetric,
  value: number,
  plusMinus: number,
  targets: ResolvedTargets,
  remarks: string[] = [],
): MetricReading {
  const info = METRIC_INFO[metric]
  const { band, layer } = targets[metric]
  const status = readAgainstTarget(value, plusMinus, band)
  return { metric, label: info.label, unit: info.unit, decimals: info.decimals, value, plusMinus, band, layer, status, remarks }
}

/**
 * Reads one analysis's touch point, heel lift and contact length against the blade's targets. Heel lift is read at
 * the heel station whenever the analysis has a station value (the heel end falls short of it, as on dance blades,
 * DESIGN.md §4), otherwise at the heel end.
 */
export function readAnalysis(result: AnalysisResult, targets: ResolvedTargets): MetricReading[] {
  const u = result.uncertainty
  const atStation = result.heelLiftStationMm !== null
  const heel = atStation
    ? reading('heelLiftMm', result.heelLiftStationMm!, u.heelLiftStationMm ?? u.heelLiftMm, targets, [
        result.heelLiftExtrapolated ? 'read at the heel station (extrapolated)' : 'read at the heel station',
      ])
    : reading('heelLiftMm', result.heelLiftMm, u.heelLiftMm, targets)
  return [
    reading('touchPointMm', result.touchPointMm, u.touchPointMm, targets),
    heel,
    reading('contactLengthMm', result.contactLengthMm, u.contactLengthMm, targets),
  ]
}

/**
 * Reads the left vs right differences of a pair (absolute, mm) against the pair targets; the ± of a difference
 * combines the two blades' ± in quadrature.
 */
export function readPair(left: AnalysisResult, right: AnalysisResult, targets: ResolvedTargets): MetricReading[] {
  const heel = (r: AnalysisResult) =>
    r.heelLiftStationMm !== null
      ? { v: r.heelLiftStationMm, pm: r.uncertainty.heelLiftStationMm ?? r.uncertainty.heelLiftMm }
      : { v: r.heelLiftMm, pm: r.uncertainty.heelLiftMm }
  const [hl, hr] = [heel(left), heel(right)]
  return [
    reading(
      'pairTouchPointDiffMm',
      Math.abs(left.touchPointMm - right.touchPointMm),
      Math.hypot(left.uncertainty.touchPointMm, right.uncertainty.touchPointMm),
      targets,
    ),
    reading('pairHeelLiftDiffMm', Math.abs(hl.v - hr.v), Math.hypot(hl.pm, hr.pm), targets),
  ]
}

/** Reads a recorded root radius (sixteenths of an inch, exact as written) and flags a hockey grind. */
export function readRootRadius(sixteenths: number, targets: ResolvedTargets): MetricReading {
  const remarks = isHockeyGrind(sixteenths) ? ['hockey grind: too little grip for most figure skaters'] : []
  return reading('rootRadiusSixteenths', sixteenths, 0, targets, remarks)
}

/** One line for people: "Touch point 41.2 ± 1.5 mm, target 35–45 mm: on target". */
export function describeReading(r: MetricReading): string {
  const value = formatValue(r.value, r.unit, r.decimals)
  const pm = r.plusMinus > 0 ? ` ± ${r.plusMinus.toFixed(r.decimals)}` : ''
  const withPm = pm ? value.replace(/ (\S+)$/, `${pm} $1`) : value
  return `${r.label} ${withPm}, target ${formatBand(r.band, r.unit, r.decimals)}: ${r.status}`
}
