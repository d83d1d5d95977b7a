import type { Vec2 } from './vec'
import { dot, norm } from './vec'

/** Which end of the traced edge, in card x, is the toe. */
export type ToeSide = 'left' | 'right'

/**
 * The blade frame expressed in card-frame mm: origin at the base pick tip B, ex along the support line L from toe
 * toward heel, ey perpendicular to L pointing away from the ice (card −y side). ex and ey are orthonormal; with the
 * toe on the right the map card → blade includes a reflection, which is what keeps "toward the heel" positive.
 */
export interface BladeFrame {
  originCard: Vec2
  exCard: Vec2
  eyCard: Vec2
}

/**
 * Builds the blade frame from B and T in card mm. ey is the unit normal of L on the side away from the ice
 * (the card's −y side, since the card's y axis points down toward the table).
 */
export function bladeFrameFromCard(basePickCard: Vec2, touchPointCard: Vec2): BladeFrame {
  const d: Vec2 = [touchPointCard[0] - basePickCard[0], touchPointCard[1] - basePickCard[1]]
  const n = norm(d)
  if (n === 0) throw new RangeError('B and T coincide; the support line is undefined')
  const ex: Vec2 = [d[0] / n, d[1] / n]
  const left: Vec2 = [ex[1], -ex[0]]
  const ey: Vec2 = left[1] <= 0 ? left : [-left[0], -left[1]]
  return { originCard: [...basePickCard], exCard: ex, eyCard: ey }
}

/** Card-frame mm → blade-frame mm ([alongMm, height above L]). */
export function cardToBlade(frame: BladeFrame, p: Vec2): Vec2 {
  const v: Vec2 = [p[0] - frame.originCard[0], p[1] - frame.originCard[1]]
  return [dot(v, frame.exCard), dot(v, frame.eyCard)]
}

/** Blade-frame mm → card-frame mm. */
export function bladeToCard(frame: BladeFrame, q: Vec2): Vec2 {
  return [
    frame.originCard[0] + q[0] * frame.exCard[0] + q[1] * frame.eyCard[0],
    frame.originCard[1] + q[0] * frame.exCard[1] + q[1] * frame.eyCard[1],
  ]
}

/**
 * Card mm → a provisional y-up frame with the toe toward −x, used before L is known: x is card x (negated when the
 * toe is on the right), y is −card y. A hull taken here is the lower hull of the edge as it stands on the table.
 */
export function cardToWork(toe: ToeSide, p: Vec2): Vec2 {
  return [toe === 'left' ? p[0] : -p[0], -p[1]]
}

/** Inverse of cardToWork. */
export function workToCard(toe: ToeSide, q: Vec2): Vec2 {
  return [toe === 'left' ? q[0] : -q[0], -q[1]]
}

/** Express a frame built in the work frame (origin, ex, ey in work coordinates) in card coordinates. */
export function workFrameToCard(toe: ToeSide, originWork: Vec2, exWork: Vec2): BladeFrame {
  const o = workToCard(toe, originWork)
  const t = workToCard(toe, [originWork[0] + exWork[0], originWork[1] + exWork[1]])
  return bladeFrameFromCard(o, t)
}
