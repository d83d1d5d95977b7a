import type { AlgebraicCircle } from './circle-fit'
import type { GeometricFit } from './circle-geometric'
import { trimmedGeometricFit } from './circle-geometric'
import type { Vec2 } from './vec'
import { degToRad, lerp } from './vec'

/** Half-length of the chord that measures the edge direction at a point (mm): long enough to average pixel noise. */
export const DIRECTION_HALF_CHORD_MM = 0.5

/**
 * Direction of the edge at each point (radians from the blade-frame x axis, y up), from the chord between the
 * points about ±halfChordMm of arc length away. Points must be ordered toe → heel.
 */
export function directionAngles(pts: readonly Vec2[], halfChordMm = DIRECTION_HALF_CHORD_MM): Float64Array {
  const n = pts.length
  const s = new Float64Array(n)
  for (let i = 1; i < n; i++) s[i] = s[i - 1] + Math.hypot(pts[i][0] - pts[i - 1][0], pts[i][1] - pts[i - 1][1])
  const out = new Float64Array(n)
  let back = 0
  let ahead = 0
  for (let i = 0; i < n; i++) {
    while (back < i && s[i] - s[back + 1] >= halfChordMm) back++
    if (ahead < i) ahead = i
    while (ahead < n - 1 && s[ahead] - s[i] < halfChordMm) ahead++
    const a = pts[back === i && i > 0 ? i - 1 : back]
    const b = pts[ahead === i && i < n - 1 ? i + 1 : ahead]
    out[i] = Math.atan2(b[1] - a[1], b[0] - a[0])
  }
  return out
}

/** A landmark on the edge: its position and the index of the first edge point at or past it. */
export interface EdgeMark {
  point: Vec2
  index: number
}

/** Interpolates the crossing of |angle| = threshold between points i−1 and i. */
function crossing(pts: readonly Vec2[], ang: Float64Array, prev: number, i: number, threshold: number): Vec2 {
  const a0 = Math.abs(ang[prev])
  const a1 = Math.abs(ang[i])
  const t = a1 === a0 ? 0 : Math.min(Math.max((threshold - a0) / (a1 - a0), 0), 1)
  return lerp(pts[prev], pts[i], t)
}

/** Arc length over which a turn must hold to count as the heel's (mm); a bump in a trace turns back sooner. */
export const HEEL_TURN_HOLD_MM = 1

/**
 * True when the edge rises more steeply than th (its direction between th and 180° − th, y up) — the heel face
 * climbs away from L. A trace that folds back on itself for a millimetre (points out of order along the rocker)
 * also turns far from L, but runs backward without rising.
 */
const rising = (angle: number, th: number): boolean => Math.sin(angle) > Math.sin(th)

/** True when the edge keeps rising beyond th from i for holdMm of arc length (or to the end of the edge). */
function turnHolds(pts: readonly Vec2[], ang: Float64Array, i: number, th: number, holdMm: number): boolean {
  for (let j = i; j < pts.length && Math.hypot(pts[j][0] - pts[i][0], pts[j][1] - pts[i][1]) < holdMm; j++)
    if (!rising(ang[j], th)) return false
  return true
}

/**
 * Heel end E: the first point behind fromIndex (toward the heel) where the edge direction turns more than
 * thresholdDeg (45°) away from L, upward, and stays turned for 1 mm — the heel face; a speck or glitch in the trace
 * turns back within a fraction of that. Null when the edge never turns that far (the heel is not in the trace).
 */
export function findHeelEnd(pts: readonly Vec2[], ang: Float64Array, fromIndex: number, thresholdDeg = 45): EdgeMark | null {
  const th = degToRad(thresholdDeg)
  for (let i = fromIndex + 1; i < pts.length; i++)
    if (rising(ang[i], th) && turnHolds(pts, ang, i, th, HEEL_TURN_HOLD_MM))
      return { point: crossing(pts, ang, i - 1, i, th), index: i }
  return null
}

/** Index of the point about offsetMm of arc length from i (negative: toward the toe), clamped to the edge. */
function stepAlong(pts: readonly Vec2[], i: number, offsetMm: number): number {
  const dir = Math.sign(offsetMm)
  let j = i
  while (j + dir >= 0 && j + dir < pts.length && Math.hypot(pts[j][0] - pts[i][0], pts[j][1] - pts[i][1]) < Math.abs(offsetMm)) j += dir
  return j
}

/**
 * Where the rocker proper meets a corner: walking from `from` in steps of `dir` (−1 toward the toe, +1 toward the
 * heel), the first point whose direction is within toleranceDeg of the direction lookMm further into the rocker.
 * A corner turns ~14°/mm, a 1.5 m rocker 0.04°/mm, so this stops within a few tenths of a millimetre of the corner's
 * start without knowing its radius. Falls back to `stop`.
 */
export function cornerStart(pts: readonly Vec2[], ang: Float64Array, from: number, stop: number, toleranceDeg = 2, lookMm = 3): number {
  const dir = Math.sign(stop - from) || 1
  const tol = degToRad(toleranceDeg)
  for (let i = from; i !== stop; i += dir) {
    const j = stepAlong(pts, i, dir * lookMm)
    if (Math.abs(ang[i] - ang[j]) <= tol) return i
  }
  return stop
}

/**
 * Rocker start: walking from T toward the toe, the first point where the edge direction departs by more than
 * toleranceDeg from the direction lookMm further toward the heel — where the rocker leaves the pick gap, whether
 * the gap's rear face is steep or a gentle ramp. Returned one chord (0.5 mm) behind that point, so no direction
 * measured on the rocker includes the gap. Tangent section joins and small kinks stay below the tolerance.
 */
export function rockerStartIndex(pts: readonly Vec2[], ang: Float64Array, touchIndex: number, toleranceDeg = 5, lookMm = 3): number {
  const tol = degToRad(toleranceDeg)
  for (let i = touchIndex - 1; i > 0; i--) {
    const j = stepAlong(pts, i, lookMm)
    if (Math.abs(ang[i] - ang[j]) > tol) return Math.min(stepAlong(pts, i, DIRECTION_HALF_CHORD_MM), touchIndex)
  }
  return 0
}

/** Last rocker point before the heel corner that rounds up into E; the corner would bend a circle fitted over it. */
export const rockerEndIndex = (pts: readonly Vec2[], ang: Float64Array, heelIndex: number, touchIndex: number): number =>
  cornerStart(pts, ang, heelIndex - 1, touchIndex)

/** Length of rocker fitted to extrapolate the heel lift to the heel station (mm). */
export const STATION_FIT_LENGTH_MM = 60

/** Height of the lower arc of an algebraic circle at x (y up), or null when the vertical line misses the circle. */
export function lowerArcY(u: AlgebraicCircle, x: number): number | null {
  const X = x - u.mean[0]
  // A·Y² + C·Y + (A·X² + B·X + D) = 0, solved stably; on a line (A = 0) it is linear.
  const k = u.a * X * X + u.b * X + u.d
  if (Math.abs(u.a) < 1e-15) return u.c === 0 ? null : u.mean[1] - k / u.c
  const disc = u.c * u.c - 4 * u.a * k
  if (disc < 0) return null
  const q = -0.5 * (u.c + Math.sign(u.c || 1) * Math.sqrt(disc))
  const roots = [q / u.a, q !== 0 ? k / q : NaN].filter(Number.isFinite)
  // The lower arc is the root nearest the circle's lowest point, which lies below its centre.
  const cy = -u.c / (2 * u.a)
  const below = roots.filter((r) => r <= cy)
  return below.length ? u.mean[1] + Math.max(...below) : null
}

/** Extrapolated heel lift at the heel station and the circle it came from. */
export interface StationExtrapolation {
  liftMm: number | null
  fit: GeometricFit
  fromAlongMm: number
  toAlongMm: number
  count: number
}

/**
 * Fits a circle to the last 60 mm of rocker (blade frame, x ≤ rockerEndX) and reads its height at stationX.
 * liftMm is null when the station lies beyond the circle's reach.
 */
export function extrapolateStationLift(pts: readonly Vec2[], rockerEndX: number, stationX: number): StationExtrapolation {
  const from = rockerEndX - STATION_FIT_LENGTH_MM
  const window = pts.filter((p) => p[0] >= from && p[0] <= rockerEndX)
  const fit = trimmedGeometricFit(window)
  return { liftMm: lowerArcY(fit.algebraic, stationX), fit, fromAlongMm: from, toAlongMm: rockerEndX, count: window.length }
}
