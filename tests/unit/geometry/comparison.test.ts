import { describe, expect, it } from 'vitest'
import type { BladeModelOptions } from '../../../shared/geometry/blade-model'
import { bladeModel } from '../../../shared/geometry/blade-model'
import { compareProfiles, pickTeeth } from '../../../shared/geometry/comparison'
import { bladeToCard } from '../../../shared/geometry/frames'
import { measureProfile } from '../../../shared/geometry/measure-profile'
import type { Vec2 } from '../../../shared/geometry/vec'
import { withNoise } from './helpers'

/** A measured blade whose rocker was ground up by `removedMm` (teeth and top edge untouched), with its top edge. */
function measured(o: BladeModelOptions, removedMm: number, seed: number) {
  const m = bladeModel(o)
  const raised = m.bladeMm.map((q): Vec2 => (q[0] > 6 ? [q[0], q[1] + removedMm] : q))
  const edge = withNoise(raised.map((q) => bladeToCard(m.frame, q)), 0.01, seed)
  const top: Vec2[] = []
  for (let x = 20; x <= 220; x += 0.2) top.push(bladeToCard(m.frame, [x, 24]))
  const p = measureProfile({ edgeMm: edge, toe: o.toe ?? 'left', sizeIn: o.sizeIn, discipline: 'freestyle', edgeSigmaMm: 0.01, calibrationSigmaMm: 0 })
  return { p, top: withNoise(top, 0.01, seed + 1) }
}

describe('profile comparison', () => {
  it('finds 0.1 mm of steel removed between two measurements, registered on teeth and top edge', () => {
    // 0.05–0.1 mm a sharpening is from memory (REFERENCES.md); the check is against the amount put in.
    const a = measured({ sizeIn: 10 }, 0, 1)
    const b = measured({ sizeIn: 10, standAlongMm: 150 }, 0.1, 2)
    const cmp = compareProfiles(a.p, b.p, { topEdgeBeforeCardMm: a.top, topEdgeAfterCardMm: b.top })
    const values = cmp.steelRemoved.map((s) => s.removedMm!)
    expect(values.length).toBeGreaterThan(15)
    for (const v of values) expect(Math.abs(v - 0.1)).toBeLessThan(0.015)
    expect(pickTeeth(a.p).every((q) => q[0] <= 1)).toBe(true)
  })

  it('compares a left blade with a right one without mirroring, in their blade frames', () => {
    const left = measured({ sizeIn: 10 }, 0, 3)
    const right = measured({ sizeIn: 10, toe: 'right' }, 0, 4)
    const cmp = compareProfiles(left.p, right.p, { topEdgeBeforeCardMm: left.top, topEdgeAfterCardMm: right.top })
    for (const s of cmp.steelRemoved) expect(Math.abs(s.removedMm!)).toBeLessThan(0.015)
    expect(Math.abs(cmp.registration.transform.rotationRad)).toBeLessThan(1e-3)
  })
})
