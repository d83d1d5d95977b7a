/**
 * Target bands and the platform defaults of DESIGN.md §5. A band is a closed interval of a metric's value; either
 * end may be open (null) for one-sided targets such as "contact length under 5 mm".
 */

/** Metrics that are read against a target band. Units are in the name (mm, or sixteenths of an inch). */
export const TARGET_METRICS = [
  'touchPointMm',
  'heelLiftMm',
  'contactLengthMm',
  'pairTouchPointDiffMm',
  'pairHeelLiftDiffMm',
  'rootRadiusSixteenths',
] as const

export type TargetMetric = (typeof TARGET_METRICS)[number]

/** Closed interval [min, max] in the metric's unit; a null end is unbounded on that side. */
export interface Band {
  min: number | null
  max: number | null
}

/** Where a default comes from: a trade habit nobody has published, or a rule we set ourselves. */
export type BandBasis = 'common practice, no published source' | 'our rule'

export interface MetricInfo {
  label: string
  /** Unit shown after the number: 'mm', or '/16 in' for a root radius in sixteenths. */
  unit: string
  decimals: number
  basis: BandBasis
  /** One line for people on why the default is what it is. */
  note: string
}

export const METRIC_INFO: Record<TargetMetric, MetricInfo> = {
  touchPointMm: {
    label: 'Touch point',
    unit: 'mm',
    decimals: 1,
    basis: 'common practice, no published source',
    note: 'Behind the base pick. Blades over 10.5 in: the upper limit moves back 2 mm per 1/4 in over (our rule).',
  },
  heelLiftMm: {
    label: 'Heel lift',
    unit: 'mm',
    decimals: 1,
    basis: 'common practice, no published source',
    note: 'Provisional: the trade measures it another way, so our geometric reading may be lower on real blades.',
  },
  contactLengthMm: {
    label: 'Contact length',
    unit: 'mm',
    decimals: 1,
    basis: 'common practice, no published source',
    note: 'A small contact patch spins with less drag.',
  },
  pairTouchPointDiffMm: {
    label: 'Touch point, left vs right',
    unit: 'mm',
    decimals: 1,
    basis: 'our rule',
    note: 'Both blades of a pair should measure alike.',
  },
  pairHeelLiftDiffMm: {
    label: 'Heel lift, left vs right',
    unit: 'mm',
    decimals: 1,
    basis: 'our rule',
    note: 'Both blades of a pair should measure alike.',
  },
  rootRadiusSixteenths: {
    label: 'Root radius',
    unit: '/16 in',
    decimals: 0,
    basis: 'common practice, no published source',
    note: '9/16 in and flatter is a hockey grind: too little grip for most figure skaters.',
  },
}

/** Nominal size (in) up to which the touch-point default is 35–45 mm. */
export const LONG_BLADE_FROM_IN = 10.5
/** Our rule: the upper touch-point limit moves back this far (mm) for each 1/4 in of nominal size over 10.5 in. */
export const LONG_BLADE_STEP_MM = 2
/** Root radius (sixteenths of an inch) from which a grind counts as a hockey grind (common practice). */
export const HOCKEY_FROM_SIXTEENTHS = 9

/** What the platform defaults depend on. */
export interface BladeFacts {
  /** Nominal blade size, inches (1/4 in steps). */
  sizeIn: number
}

/**
 * Upper touch-point limit (mm behind the base pick) for a blade of nominal size sizeIn: 45 mm up to 10.5 in, then
 * 2 mm further back for each whole 1/4 in step over (our rule; sizes between steps count the steps they complete).
 */
export function touchPointUpperMm(sizeIn: number): number {
  const steps = Math.max(0, Math.floor((sizeIn - LONG_BLADE_FROM_IN) * 4 + 1e-9))
  return 45 + LONG_BLADE_STEP_MM * steps
}

/** The platform's default bands for a blade (DESIGN.md §5). */
export function platformDefaults(blade: BladeFacts): Record<TargetMetric, Band> {
  return {
    touchPointMm: { min: 35, max: touchPointUpperMm(blade.sizeIn) },
    heelLiftMm: { min: 15, max: 35 },
    contactLengthMm: { min: null, max: 5 },
    pairTouchPointDiffMm: { min: null, max: 3 },
    pairHeelLiftDiffMm: { min: null, max: 2 },
    rootRadiusSixteenths: { min: 5, max: 8 },
  }
}

/** True for a root radius (sixteenths of an inch) in the hockey range: 9/16 in and flatter. */
export const isHockeyGrind = (rootRadiusSixteenths: number): boolean =>
  rootRadiusSixteenths >= HOCKEY_FROM_SIXTEENTHS - 1e-9

/**
 * A band written for people: "35–45 mm", "under 5 mm", "at least 15 mm". Limits are set by people in round
 * numbers, so trailing zeros are dropped (up to `decimals` places are kept).
 */
export function formatBand(band: Band, unit: string, decimals = 1): string {
  const num = (v: number) => String(Number(v.toFixed(decimals)))
  const n = (v: number) => `${num(v)}${unit.startsWith('/') ? '' : ' '}${unit}`
  // A fraction keeps its denominator on both ends ("5/16–8/16 in"); other units are written once at the end.
  const lower = (v: number) => `${num(v)}${unit.startsWith('/') ? unit.split(' ')[0] : ''}`
  if (band.min !== null && band.max !== null) return `${lower(band.min)}–${n(band.max)}`
  if (band.max !== null) return `under ${n(band.max)}`
  if (band.min !== null) return `at least ${n(band.min)}`
  return 'any value'
}

/** A value with its unit, e.g. "41.2 mm" or "7/16 in". */
export const formatValue = (value: number, unit: string, decimals: number): string =>
  `${value.toFixed(decimals)}${unit.startsWith('/') ? '' : ' '}${unit}`
