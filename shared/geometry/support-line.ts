import type { Circle } from './circle-fit'
import type { GeometricFit } from './circle-geometric'
import { trimmedGeometricFit } from './circle-geometric'
import { lowerHull } from './hull'
import { ProfileError } from './profile-error'
import type { Vec2 } from './vec'
import { add, dist, dot, norm, rotate, scale, sub, unit } from './vec'

/** Shortest pick gap we accept as the B–T bridge; shorter means the picks are missing from the edge (mm). */
const MIN_BRIDGE_MM = 15

/** Hull vertices of B and of the provisional touch point, as indices into the work-frame edge. */
export interface SupportHull {
  basePickIndex: number
  touchIndex: number
}

/**
 * Finds the support line L on an edge in a y-up frame with the toe toward −x (mm): the longest edge of the lower
 * convex hull in front of the rocker's lowest point that starts at a tooth tip among the toe picks. Its front end is
 * the base pick tip B, its rear end the provisional touch point. (On a clean edge this is simply the longest hull edge
 * in front of the lowest point; asking for a tooth tip and for the pick gap under the bridge keeps a traced rocker's
 * small bumps and a rocker start behind a hole in the trace from posing as B.) Throws BLADE_CUT_OFF when no such
 * bridge exists (no toe picks in the edge), and BLADE_NOT_FOUND when the picks are there but no bridge starts at a
 * tooth tip over the gap (the trace lost the base pick).
 */
export function findSupportHull(work: readonly Vec2[]): SupportHull {
  const xs = work.map((p) => p[0])
  const [minX, maxX] = [Math.min(...xs), Math.max(...xs)]
  // The picks occupy the front tenth of a blade: the rocker's lowest point is looked for behind the front fifth (in
  // case a tilted photo puts a pick tip level with the rocker), and B within it.
  const pickZoneEnd = minX + PICK_ZONE_SHARE * (maxX - minX)
  let lowest = -1
  for (let i = 0; i < work.length; i++)
    if (work[i][0] >= pickZoneEnd && (lowest < 0 || work[i][1] < work[lowest][1])) lowest = i
  const hull = lowerHull(work)
  let best: SupportHull | null = null
  let bestLength = 0
  let anyBridge = false
  for (let k = 0; k + 1 < hull.length; k++) {
    const a = hull[k]
    const b = hull[k + 1]
    if (work[b][0] > work[lowest][0]) break
    const length = dist(work[a], work[b])
    if (length < MIN_BRIDGE_MM) continue
    anyBridge = true
    if (work[a][0] <= pickZoneEnd && length > bestLength && isToothTip(work, a) && spansPickGap(work, a, b)) {
      bestLength = length
      best = { basePickIndex: a, touchIndex: b }
    }
  }
  if (!anyBridge)
    throw new ProfileError('BLADE_CUT_OFF', 'The toe picks are not in the traced edge, so the base pick cannot be found.')
  if (!best)
    throw new ProfileError('BLADE_NOT_FOUND', 'The base pick could not be told apart from the rocker in the traced edge.')
  return best
}

/**
 * Least height of the pick gap over the bridge, mm: B → T spans the gap between the toe picks and the rocker, a few
 * millimetres deep (common practice, no published source), while a bridge along the rocker stays within tenths of
 * it. Where the trace lost the base pick and part of the gap, the rocker's start can pose as a tooth tip; it spans
 * no gap.
 */
const MIN_GAP_HEIGHT_MM = 1

/** Whether the edge between hull vertices a and b rises at least MIN_GAP_HEIGHT_MM above the line through them. */
function spansPickGap(work: readonly Vec2[], a: number, b: number): boolean {
  const u = unit(sub(work[b], work[a]))
  const up = rotate(u, Math.PI / 2)
  for (let i = a + 1; i < b; i++) if (dot(sub(work[i], work[a]), up) >= MIN_GAP_HEIGHT_MM) return true
  return false
}

/** Share of the blade's length, from the toe end, within which the base pick lies (common practice, no published source). */
const PICK_ZONE_SHARE = 0.2

/** A tooth's front face rises at least this much within TOOTH_FACE_ARC_MM in front of its tip (mm). */
export const TOOTH_FACE_RISE_MM = 0.3
export const TOOTH_FACE_ARC_MM = 2

/**
 * True when the edge rises by TOOTH_FACE_RISE_MM within TOOTH_FACE_ARC_MM in front of point i, as a pick tooth's
 * front face does; along a rocker it rises by hundredths. A bridge that starts on the rocker means the trace
 * lost the base pick's tip, and any touch point read from it would be wrong by tens of millimetres.
 */
export function isToothTip(work: readonly Vec2[], i: number): boolean {
  let arc = 0
  for (let j = i - 1; j >= 0; j--) {
    const step = dist(work[j], work[j + 1])
    // On a sparse trace the face may reach past the arc within one segment: read it where the arc ends.
    const t = arc + step > TOOTH_FACE_ARC_MM ? (TOOTH_FACE_ARC_MM - arc) / step : 1
    const y = work[j + 1][1] + t * (work[j][1] - work[j + 1][1])
    if (y - work[i][1] >= TOOTH_FACE_RISE_MM) return true
    arc += step
    if (arc >= TOOTH_FACE_ARC_MM) break
  }
  return false
}

/**
 * Tangent point on a circle of the line from an outside point b that passes below the circle (the circle lies on
 * the left of the direction b → tangent point, i.e. above it in a y-up frame with the heel toward +x).
 * Null when b is inside the circle.
 */
export function lowerTangentPoint(b: Vec2, circle: Circle): Vec2 | null {
  const toCentre: Vec2 = [circle.cx - b[0], circle.cy - b[1]]
  const d = norm(toCentre)
  if (!(d > circle.r) || !Number.isFinite(circle.r)) return null
  const dir = rotate(unit(toCentre), -Math.asin(circle.r / d))
  return add(b, scale(dir, Math.sqrt(d * d - circle.r * circle.r)))
}

/** Result of refining T: the tangent point and the local rocker circle it was found on (work frame, mm). */
export interface TouchRefinement {
  touch: Vec2
  fit: GeometricFit | null
  windowCount: number
}

/** Half-width of the rocker window fitted around T (mm); the same 40 mm as a radius-profile window. */
export const TOUCH_HALF_WINDOW_MM = 20

/**
 * Refines T: fits a geometric circle to the rocker within ±20 mm of the provisional T (only points within 1.5 mm
 * of the current L, which excludes the pick teeth) and takes the tangent point of the line from B to that circle.
 * Done twice so the window ends up centred on the refined T. Falls back to the hull vertex on a straight rocker.
 */
export function refineTouchPoint(work: readonly Vec2[], fromIndex: number, b: Vec2, provisional: Vec2): TouchRefinement {
  let touch = provisional
  let result: TouchRefinement = { touch, fit: null, windowCount: 0 }
  for (let round = 0; round < 2; round++) {
    const u = unit(sub(touch, b))
    const up = rotate(u, Math.PI / 2)
    const at = dist(touch, b)
    const lo = Math.max(at - TOUCH_HALF_WINDOW_MM, 0.5 * at)
    const window: Vec2[] = []
    for (let i = fromIndex; i < work.length; i++) {
      const v = sub(work[i], b)
      const along = dot(v, u)
      if (along >= lo && along <= at + TOUCH_HALF_WINDOW_MM && dot(v, up) < 1.5) window.push(work[i])
    }
    if (window.length < 10) return result
    const fit = trimmedGeometricFit(window)
    const tangent = fit.circle.cy > touch[1] ? lowerTangentPoint(b, fit.circle) : null
    if (!tangent) return { touch, fit, windowCount: window.length }
    touch = tangent
    result = { touch, fit, windowCount: window.length }
  }
  return result
}
