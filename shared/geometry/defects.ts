import { prattAlgebraic } from './circle-fit'
import { signedCurvature } from './circle-geometric'
import { fitWindow, slice } from './radius-profile'
import { curvatureSigma } from './uncertainty'
import type { Vec2 } from './vec'
import { fitLineYOnX, radToDeg } from './vec'

/** A flat spot is radius over 10 m (|curvature| under 1e-4 /mm, or hollowed) for 10 mm or more (DESIGN §4.6). */
export const FLAT_CURVATURE = 1e-4
export const FLAT_MIN_LENGTH_MM = 10
/**
 * Shortest window of the flat-spot scan (mm). A 10 mm window cannot tell 10 m from 2 m under pixel noise (the sag
 * is 1.25 µm), so we scan windows of 20 mm or more every 1 mm and report each run widened by a quarter window on
 * each side, which recovers a flat's true extent to about ±2 mm on a 2 m rocker with 20 mm windows. The scan uses
 * Pratt's algebraic fit, which on arcs this flat agrees with the geometric fit far inside the noise and costs a
 * tenth as much.
 */
export const FLAT_WINDOW_MM = 20
/** Longest scan window: the radius profile's own 40 mm. */
export const FLAT_WINDOW_MAX_MM = 40

/**
 * Scan window for flat spots on this edge: the shortest from 20 to 40 mm (2 mm steps) over which a window's
 * curvature noise is at most a third of the 1e-4 /mm flat threshold, so noise alone does not read as a flat.
 * Null when even 40 mm is too noisy: flat spots cannot be told on this edge. averagingSigmaMm as in NoiseModel.
 */
export function flatScanWindow(rocker: readonly Vec2[], averagingSigmaMm: number): number | null {
  if (rocker.length < 2) return null
  const spacing = Math.max((rocker[rocker.length - 1][0] - rocker[0][0]) / (rocker.length - 1), 1e-3)
  for (let w = FLAT_WINDOW_MM; w <= FLAT_WINDOW_MAX_MM; w += 2)
    if (curvatureSigma(averagingSigmaMm, w / spacing, w) <= FLAT_CURVATURE / 3) return w
  return null
}

export interface FlatSpot {
  fromAlongMm: number
  toAlongMm: number
  radiusMm: number | null
}

/**
 * Flat spots on a rocker (blade frame, sorted by x, from startX to endX): runs of scan windows (flatScanWindow)
 * whose curvature is under 1e-4 /mm, or hollowed, spanning 10 mm or more; each with the radius fitted over it.
 */
export function findFlatSpots(rocker: readonly Vec2[], startX: number, endX: number, averagingSigmaMm = 0): FlatSpot[] {
  const window = flatScanWindow(rocker, averagingSigmaMm)
  if (window === null) return []
  const half = window / 2
  const runs: [number, number][] = []
  let runStart: number | null = null
  let last = 0
  for (let c = Math.ceil(startX + half); c <= endX - half; c += 1) {
    const pts = slice(rocker, c - half, c + half)
    const flat = pts.length >= 10 && signedCurvature(prattAlgebraic(pts)) < FLAT_CURVATURE
    if (flat && runStart === null) runStart = c
    if (!flat && runStart !== null) {
      runs.push([runStart, last])
      runStart = null
    }
    last = c
  }
  if (runStart !== null) runs.push([runStart, last])
  return runs
    .map(([a, b]): [number, number] => [Math.max(a - half / 2, startX), Math.min(b + half / 2, endX)])
    .filter(([a, b]) => b - a >= FLAT_MIN_LENGTH_MM)
    .map(([a, b]) => ({ fromAlongMm: a, toAlongMm: b, radiusMm: fitWindow(rocker, a, b)?.radiusMm ?? null }))
}

/** Slope of the least-squares line through the points (dy/dx) and its standard error per unit of point noise. */
function lineSlope(pts: readonly Vec2[]): { slope: number; unitSigma: number } | null {
  return pts.length < 3 ? null : fitLineYOnX(pts)
}

export interface Kink {
  alongMm: number
  angleDeg: number
}

/** A kink changes direction by more than 1° within 2 mm, beyond what the fitted rocker curvature explains. */
export const KINK_DEG = 1
export const KINK_SPAN_MM = 2
export const KINK_NOISE_SIGMAS = 5

/**
 * Scans the rocker every 0.25 mm: the direction of a line fitted over the 2 mm before each station is compared
 * with the 2 mm after it; the change expected from the local curvature (trend) is removed. A station counts when
 * the excess is over 1° and over 5σ of the line-fit noise (edgeSigmaMm): a blade has some hundred independent 2 mm
 * stretches, and 5σ keeps pixel noise from reading as a kink on any of them.
 * Each run of counting stations reports its largest excess.
 */
export function findKinks(
  rocker: readonly Vec2[],
  startX: number,
  endX: number,
  curvatureAt: (x: number) => number,
  edgeSigmaMm: number,
): Kink[] {
  const kinks: Kink[] = []
  let current: Kink | null = null
  for (let x = startX + KINK_SPAN_MM; x <= endX - KINK_SPAN_MM; x += 0.25) {
    const before = lineSlope(slice(rocker, x - KINK_SPAN_MM, x))
    const after = lineSlope(slice(rocker, x, x + KINK_SPAN_MM))
    let excess = 0
    if (before && after) {
      const turn = Math.atan(after.slope) - Math.atan(before.slope)
      excess = turn - curvatureAt(x) * KINK_SPAN_MM
      const noise = edgeSigmaMm * Math.hypot(before.unitSigma, after.unitSigma)
      if (Math.abs(excess) <= Math.max((KINK_DEG * Math.PI) / 180, KINK_NOISE_SIGMAS * noise)) excess = 0
    }
    if (excess !== 0 && (!current || Math.abs(radToDeg(excess)) > Math.abs(current.angleDeg)))
      current = { alongMm: x, angleDeg: radToDeg(excess) }
    if (excess === 0 && current) {
      kinks.push(current)
      current = null
    }
  }
  if (current) kinks.push(current)
  return kinks
}
