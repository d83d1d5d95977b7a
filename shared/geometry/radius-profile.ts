import { signedCurvature, trimmedGeometricFit } from './circle-geometric'
import type { Vec2 } from './vec'

/** Window of each radius-profile fit and its step (mm), per DESIGN §4.6. */
export const PROFILE_WINDOW_MM = 40
export const PROFILE_STEP_MM = 5
/** Below this |curvature| (1/mm), i.e. beyond 100 m, a radius is not meaningful and is reported as null. */
export const STRAIGHT_CURVATURE = 1e-5

/** One fitted window: centre (blade-frame x, mm), signed curvature (1/mm, + bulging toward the ice), fit details. */
export interface WindowFit {
  alongMm: number
  curvaturePerMm: number
  radiusMm: number | null
  rmsMm: number
  count: number
}

/** Index of the first point with x ≥ value in points sorted by x. */
function lowerBound(pts: readonly Vec2[], value: number): number {
  let lo = 0
  let hi = pts.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (pts[mid][0] < value) lo = mid + 1
    else hi = mid
  }
  return lo
}

/** Points of a rocker (sorted by x) with from ≤ x ≤ to. */
export function slice(rocker: readonly Vec2[], from: number, to: number): Vec2[] {
  return rocker.slice(lowerBound(rocker, from), lowerBound(rocker, to + 1e-12))
}

/** Geometric circle fit over [from, to] of a rocker in the blade frame; null with fewer than 10 points. */
export function fitWindow(rocker: readonly Vec2[], from: number, to: number): WindowFit | null {
  const pts = slice(rocker, from, to)
  if (pts.length < 10) return null
  const fit = trimmedGeometricFit(pts)
  const k = signedCurvature(fit.algebraic)
  return {
    alongMm: (from + to) / 2,
    curvaturePerMm: k,
    radiusMm: Math.abs(k) < STRAIGHT_CURVATURE ? null : 1 / Math.abs(k),
    rmsMm: fit.rms,
    count: fit.kept,
  }
}

/**
 * Rocker radius profile: geometric circle fits over 40 mm windows whose centres step every 5 mm (on multiples of
 * 5 mm along L) from rocker start + 20 mm to E − 20 mm, so every window lies wholly on the rocker.
 * `rocker` holds blade-frame points from S to E sorted by x.
 */
export function radiusProfile(rocker: readonly Vec2[], startX: number, endX: number): WindowFit[] {
  const half = PROFILE_WINDOW_MM / 2
  const out: WindowFit[] = []
  for (let c = Math.ceil((startX + half) / PROFILE_STEP_MM) * PROFILE_STEP_MM; c <= endX - half + 1e-9; c += PROFILE_STEP_MM) {
    const w = fitWindow(rocker, c - half, c + half)
    if (w) out.push(w)
  }
  return out
}

/** Section radii (mm), one circle per section; null for a section shorter than 10 mm or straight. */
export interface SectionRadii {
  toeMm: number | null
  middleMm: number | null
  heelMm: number | null
}

function sectionRadius(rocker: readonly Vec2[], from: number, to: number): number | null {
  if (to - from < 10) return null
  const w = fitWindow(rocker, from, to)
  return w ? w.radiusMm : null
}

/** Toe = rocker start to T + 20 mm, middle = T + 20 to T + 100 mm, heel = T + 100 mm to E (DESIGN §4.6). */
export function sectionRadii(rocker: readonly Vec2[], startX: number, touchX: number, endX: number): SectionRadii {
  const a = Math.min(touchX + 20, endX)
  const b = Math.min(touchX + 100, endX)
  return {
    toeMm: sectionRadius(rocker, startX, a),
    middleMm: sectionRadius(rocker, a, b),
    heelMm: sectionRadius(rocker, b, endX),
  }
}
