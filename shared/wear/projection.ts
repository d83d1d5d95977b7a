import type { Band } from '../targets/bands'

/** One metric value at a point of a blade's life: x = sharpenings so far, y = the metric (its own unit). */
export interface WearPoint {
  sharpenings: number
  value: number
}

/** y = intercept + slope · x. */
export interface Line {
  slope: number
  intercept: number
}

const median = (values: number[]): number => {
  const s = [...values].sort((a, b) => a - b)
  const m = s.length >> 1
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2
}

/**
 * Theil–Sen line: the median of the slopes between every pair of points with different x, and the median of
 * y − slope·x as intercept (Sen, JASA 63 (1968)). Up to about 29 % of points can be wild without moving it, which
 * matters here: one badly lit photo must not bend a blade's wear trend. Null with fewer than two distinct x.
 */
export function theilSen(points: readonly { x: number; y: number }[]): Line | null {
  const slopes: number[] = []
  for (let i = 0; i < points.length; i++) {
    for (let j = i + 1; j < points.length; j++) {
      const dx = points[j].x - points[i].x
      if (dx !== 0) slopes.push((points[j].y - points[i].y) / dx)
    }
  }
  if (slopes.length === 0) return null
  const slope = median(slopes)
  return { slope, intercept: median(points.map((p) => p.y - slope * p.x)) }
}

export interface WearProjection {
  /** The robust line of the metric against sharpening count; null when there are too few points. */
  line: Line | null
  /** The latest sharpening count in the series: where "now" is on the line. */
  nowSharpenings: number | null
  /** The line's value now, in the metric's unit. */
  nowValue: number | null
  /** Which edge of the band the trend heads for; null when it heads for an open end or is flat. */
  towards: 'min' | 'max' | null
  /**
   * Whole sharpenings after now that the trend stays inside the band: 0 when it is already outside (or leaves at
   * the next one); null when it never leaves or there are too few points to say.
   */
  remaining: number | null
}

/** Fewest distinct sharpening counts a projection needs: two points make a line, not a trend. */
export const MIN_PROJECTION_POINTS = 3

/** Slope magnitude (unit per sharpening) below which a trend counts as flat. */
const FLAT_SLOPE = 1e-9

/**
 * Projects how many more sharpenings a metric stays inside its target band, from a Theil–Sen line of the metric
 * against sharpening count. The count is taken from the latest point in the series.
 */
export function projectWear(series: readonly WearPoint[], band: Band, minPoints = MIN_PROJECTION_POINTS): WearProjection {
  const empty: WearProjection = { line: null, nowSharpenings: null, nowValue: null, towards: null, remaining: null }
  const distinct = new Set(series.map((p) => p.sharpenings)).size
  if (distinct < Math.max(2, minPoints)) return empty
  const line = theilSen(series.map((p) => ({ x: p.sharpenings, y: p.value })))!
  const now = Math.max(...series.map((p) => p.sharpenings))
  const nowValue = line.intercept + line.slope * now
  const towards: WearProjection['towards'] = line.slope > FLAT_SLOPE ? 'max' : line.slope < -FLAT_SLOPE ? 'min' : null
  const base = { line, nowSharpenings: now, nowValue, towards }
  const outside = (band.min !== null && nowValue < band.min) || (band.max !== null && nowValue > band.max)
  if (outside) return { ...base, remaining: 0 }
  const edge = towards === 'max' ? band.max : towards === 'min' ? band.min : null
  if (edge === null) return { ...base, towards: null, remaining: null }
  // The line is inside now and heads for `edge`: count the whole sharpenings before it passes it.
  const crossing = (edge - line.intercept) / line.slope
  return { ...base, remaining: Math.max(0, Math.floor(crossing - now + 1e-9)) }
}
