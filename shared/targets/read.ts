import type { Band } from './bands'

/** Our status words (DESIGN.md §5). Status is told in words and by the marker's position, never by colour. */
export const TARGET_STATUSES = ['on target', 'near limit', 'off target'] as const
export type TargetStatus = (typeof TARGET_STATUSES)[number]

/** Share of the band's width, outside the band, that still reads "near limit" rather than "off target". */
export const NEAR_OUTSIDE_SHARE = 0.1

/**
 * Width of a band for the 10 % rule, in the metric's unit. A one-sided band ("under 5 mm") is read as running from
 * zero to its limit, since every metric with a one-sided target is a size or a difference that cannot go below
 * zero (our rule).
 */
export function bandWidth(band: Band): number {
  if (band.min !== null && band.max !== null) return band.max - band.min
  return Math.abs(band.max ?? band.min ?? 0)
}

/**
 * How far value lies outside band (0 inside or on an edge), and how close it is to the nearest edge from inside
 * (Infinity when the band is open on both sides). Same unit as the value.
 */
export function bandDistances(value: number, band: Band): { outside: number; insideMargin: number } {
  const below = band.min !== null ? band.min - value : -Infinity
  const above = band.max !== null ? value - band.max : -Infinity
  const outside = Math.max(0, below, above)
  const insideMargin = outside > 0 ? 0 : Math.min(-below, -above)
  return { outside, insideMargin }
}

/**
 * Reads a measured value with its ± against a target band (DESIGN.md §5):
 * - `near limit` when the value is inside the band (edges included) but no more than its ± from an edge, or
 *   outside the band by no more than 10 % of the band's width;
 * - `on target` when inside and further than its ± from both edges;
 * - `off target` otherwise.
 * A value exactly on an edge is `near limit` even with a ± of zero: one more sharpening can take it out.
 */
export function readAgainstTarget(value: number, plusMinus: number, band: Band): TargetStatus {
  if (!Number.isFinite(value)) throw new RangeError('value must be a finite number')
  const pm = Math.max(0, Number.isFinite(plusMinus) ? plusMinus : 0)
  const { outside, insideMargin } = bandDistances(value, band)
  // A tiny allowance so values computed in floating point (41.0 − 0.1 …) land on the side people expect.
  const eps = 1e-9
  if (outside > eps) return outside <= NEAR_OUTSIDE_SHARE * bandWidth(band) + eps ? 'near limit' : 'off target'
  return insideMargin <= pm + eps ? 'near limit' : 'on target'
}
