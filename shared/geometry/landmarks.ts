import type { GeometricFit } from './circle-geometric'
import type { BladeFrame, ToeSide } from './frames'
import { workFrameToCard } from './frames'
import { cardToWork } from './frames'
import { ProfileError } from './profile-error'
import { findSupportHull, refineTouchPoint } from './support-line'
import type { Vec2 } from './vec'
import { dist, sub, unit } from './vec'

/** The support line found on an edge: the blade frame it defines and the rocker circle fitted at T. */
export interface Support {
  frame: BladeFrame
  /** Index of B in the toe → heel ordered edge. */
  basePickIndex: number
  touchPointMm: number
  touchFit: GeometricFit | null
  touchWindowCount: number
}

/** Edge points in the work frame, ordered toe → heel, and whether the input order had to be reversed. */
export function orderedWork(edgeMm: readonly Vec2[], toe: ToeSide): { work: Vec2[]; card: Vec2[] } {
  for (const p of edgeMm)
    if (!Number.isFinite(p[0]) || !Number.isFinite(p[1]))
      throw new ProfileError('BLADE_NOT_FOUND', 'The traced edge contains invalid points.')
  const work = edgeMm.map((p) => cardToWork(toe, p))
  const reversed = work[0][0] > work[work.length - 1][0]
  return { work: reversed ? work.reverse() : work, card: reversed ? [...edgeMm].reverse() : [...edgeMm] }
}

/** L from B at basePickIndex, tangent to the rocker circle near the provisional touch point (work frame). */
function supportFrom(work: readonly Vec2[], toe: ToeSide, basePickIndex: number, provisional: Vec2): Support {
  const b = work[basePickIndex]
  const refined = refineTouchPoint(work, basePickIndex, b, provisional)
  return {
    frame: workFrameToCard(toe, b, unit(sub(refined.touch, b))),
    basePickIndex,
    touchPointMm: dist(b, refined.touch),
    touchFit: refined.fit,
    touchWindowCount: refined.windowCount,
  }
}

/** Detects B and T (DESIGN §4.3) on a work-frame edge ordered toe → heel. */
export function detectSupport(work: readonly Vec2[], toe: ToeSide): Support {
  const hull = findSupportHull(work)
  return supportFrom(work, toe, hull.basePickIndex, work[hull.touchIndex])
}

/**
 * Moves B to where a person dragged it: among edge points in front of T within 0.5 mm of alongMm (detected frame),
 * the lowest one — the tip a support line would rest on; else the point nearest in along. L is then the line from
 * the new B resting on the rocker (from rockerFromIndex on): the least steep line to any rocker point, refined by
 * the local circle as in detection.
 */
export function overrideBasePick(
  work: readonly Vec2[],
  toe: ToeSide,
  detected: Support,
  blade: readonly Vec2[],
  alongMm: number,
  rockerFromIndex: number,
): Support {
  let best = -1
  let nearest = 0
  for (let i = 0; i < blade.length && blade[i][0] < detected.touchPointMm; i++) {
    if (Math.abs(blade[i][0] - alongMm) < Math.abs(blade[nearest][0] - alongMm)) nearest = i
    if (Math.abs(blade[i][0] - alongMm) <= 0.5 && (best < 0 || blade[i][1] < blade[best][1])) best = i
  }
  const b = work[best >= 0 ? best : nearest]
  let rest = Math.max(rockerFromIndex, (best >= 0 ? best : nearest) + 1)
  const slope = (p: Vec2) => Math.atan2(p[1] - b[1], p[0] - b[0])
  for (let i = rest; i < work.length; i++) if (work[i][0] > b[0] && slope(work[i]) < slope(work[rest])) rest = i
  return supportFrom(work, toe, best >= 0 ? best : nearest, work[rest])
}
