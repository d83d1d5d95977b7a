import { prattAlgebraic } from './circle-fit'
import { signedCurvature } from './circle-geometric'
import { fitWindow, slice } from './radius-profile'
import type { Vec2 } from './vec'
import { radToDeg } from './vec'

/** A flat spot is radius over 10 m (|curvature| under 1e-4 /mm, or hollowed) for 10 mm or more (DESIGN §4.6). */
export const FLAT_CURVATURE = 1e-4
export const FLAT_MIN_LENGTH_MM = 10
/**
 * Window of the flat-spot scan (mm). A 10 mm window cannot tell 10 m from 2 m under pixel noise (the sag is
 * 1.25 µm), so we scan 20 mm windows every 1 mm and report each run widened by a quarter window on each side,
 * which recovers a flat's true extent to about ±2 mm on a 2 m rocker. The scan uses Pratt's algebraic fit, which on
 * arcs this flat agrees with the geometric fit far inside the noise and costs a tenth as much.
 */
export const FLAT_WINDOW_MM = 20

export interface FlatSpot {
  fromAlongMm: number
  toAlongMm: number
  radiusMm: number | null
}

export function findFlatSpots(rocker: readonly Vec2[], startX: number, endX: number): FlatSpot[] {
  const half = FLAT_WINDOW_MM / 2
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
  if (pts.length < 3) return null
  const mx = pts.reduce((s, p) => s + p[0], 0) / pts.length
  const my = pts.reduce((s, p) => s + p[1], 0) / pts.length
  let sxx = 0
  let sxy = 0
  for (const p of pts) {
    sxx += (p[0] - mx) ** 2
    sxy += (p[0] - mx) * (p[1] - my)
  }
  return sxx > 0 ? { slope: sxy / sxx, unitSigma: 1 / Math.sqrt(sxx) } : null
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
