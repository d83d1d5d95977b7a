import type { BladeFrame } from './frames'
import { cardToBlade } from './frames'
import type { Registration } from './registration'
import { applySimilarity, registerProfiles, steelRemoved } from './registration'
import type { Vec2 } from './vec'

/** What a comparison needs of one measurement (the fields measureProfile returns). */
export interface ComparableProfile {
  /** Edge in its own blade frame (x along L from B toward the heel, y up), ordered toe → heel. */
  bladeMm: readonly Vec2[]
  rockerStartAlongMm: number
  rockerEndAlongMm: number
  frame: BladeFrame
}

/** Toe-pick teeth of a measured edge: everything in front of 1 mm behind B, which sharpening does not reach. */
export const pickTeeth = (p: ComparableProfile): Vec2[] => p.bladeMm.filter((q) => q[0] <= 1)

export interface ProfileComparison {
  /** Takes the later profile's blade frame onto the earlier one's. */
  registration: Registration
  /** The later rocker in the earlier blade frame. */
  afterRockerMm: Vec2[]
  /** Steel removed at each station (mm, + = the running surface rose toward the top edge). */
  steelRemoved: { alongMm: number; removedMm: number | null }[]
}

/**
 * Compares two measurements of one blade (or the two blades of a pair: blade frames already run toe → heel with y
 * up for either foot, so no mirroring is needed here) on what sharpening does not touch: the pick teeth and,
 * when the engine traced it, the runner's top edge in card mm. Without a top edge only the teeth hold the
 * rotation, so heights far behind them are much less certain. Stations default to every 10 mm along the rocker.
 */
export function compareProfiles(
  before: ComparableProfile,
  after: ComparableProfile,
  opts: { topEdgeBeforeCardMm?: readonly Vec2[]; topEdgeAfterCardMm?: readonly Vec2[]; stationsMm?: readonly number[] } = {},
): ProfileComparison {
  const fixed: Vec2[][] = [pickTeeth(before)]
  const moving: Vec2[][] = [pickTeeth(after)]
  if (opts.topEdgeBeforeCardMm?.length && opts.topEdgeAfterCardMm?.length) {
    fixed.push(opts.topEdgeBeforeCardMm.map((p) => cardToBlade(before.frame, p)))
    moving.push(opts.topEdgeAfterCardMm.map((p) => cardToBlade(after.frame, p)))
  }
  const registration = registerProfiles(fixed, moving, { initial: { scale: 1, rotationRad: 0, tx: 0, ty: 0 } })
  const rockerOf = (p: ComparableProfile) => p.bladeMm.filter((q) => q[0] >= p.rockerStartAlongMm && q[0] <= p.rockerEndAlongMm)
  const afterRockerMm = rockerOf(after).map((q) => applySimilarity(registration.transform, q))
  const from = Math.ceil(Math.max(before.rockerStartAlongMm, afterRockerMm[0]?.[0] ?? Infinity) / 10) * 10
  const to = Math.min(before.rockerEndAlongMm, afterRockerMm[afterRockerMm.length - 1]?.[0] ?? -Infinity)
  const stations = opts.stationsMm ?? Array.from({ length: Math.max(0, Math.floor((to - from) / 10) + 1) }, (_, i) => from + 10 * i)
  return { registration, afterRockerMm, steelRemoved: steelRemoved(rockerOf(before), afterRockerMm, stations) }
}
