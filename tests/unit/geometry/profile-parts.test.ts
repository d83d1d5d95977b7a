import { describe, expect, it } from 'vitest'
import { findSupportHull, isToothTip, lowerTangentPoint, refineTouchPoint } from '../../../shared/geometry/support-line'
import {
  directionAngles,
  extrapolateStationLift,
  findHeelEnd,
  lowerArcY,
  rockerEndIndex,
  rockerStartIndex,
} from '../../../shared/geometry/heel'
import { fitWindow, radiusProfile, sectionRadii, slice } from '../../../shared/geometry/radius-profile'
import { findFlatSpots, findKinks, flatScanWindow } from '../../../shared/geometry/defects'
import { geometricFit } from '../../../shared/geometry/circle-geometric'
import { ProfileError } from '../../../shared/geometry/profile-error'
import type { Vec2 } from '../../../shared/geometry/vec'
import { withNoise, withSmoothedNoise } from './helpers'

/** Lower arc of a circle of radius r touching y = 0 at x = x0, sampled every step mm over [from, to]. */
function arc(r: number, x0: number, from: number, to: number, step = 0.1): Vec2[] {
  const out: Vec2[] = []
  for (let x = from; x <= to + 1e-9; x += step) out.push([x, r - Math.sqrt(r * r - (x - x0) ** 2)])
  return out
}

describe('support line', () => {
  it('bridges from the lowest tooth to the rocker and refuses an edge without picks', () => {
    const teeth: Vec2[] = [[-12, 4], [-9, 6], [-6, 1.5], [-3, 4], [0, 0], [2, 5]]
    const rocker = arc(2000, 40, 5, 200)
    const work = [...teeth, ...rocker]
    const hull = findSupportHull(work)
    expect(work[hull.basePickIndex]).toEqual([0, 0])
    expect(work[hull.touchIndex][0]).toBeCloseTo(40, 0)
    expect(() => findSupportHull(rocker)).toThrow(ProfileError)
  })

  it('refuses a bridge that starts on the rocker, as when a trace rounds the base pick off', () => {
    // The tip traced too high and a wavy rocker: the longest bridge in front of the lowest point runs from x = 17
    // on the rocker, not from a tooth.
    const blunted: Vec2[] = [[-12, 4], [-9, 6], [-6, 3], [-3, 4], [0, 1.1], [2, 5], [5, 0.6], [10, 0.3], [17, 0.05],
      [27, 0.1], [37, 0], [60, -0.5], [120, -1], [200, -0.2], [203, 5]]
    expect(isToothTip(blunted, 4)).toBe(true)
    expect(isToothTip(blunted, 8)).toBe(false)
    expect(() => findSupportHull(blunted)).toThrow(/told apart/)
  })

  it('refuses a bridge from the rocker\u2019s start when the trace lost the base pick and the foot of the gap', () => {
    // The pick gap's rear face traced down to x = 7.6, then nothing until the rocker at x = 10.2: across that hole the
    // edge "rises" 1.6 mm within 2 mm, as a tooth's face would, but the bridge from x = 10.2 runs along the rocker
    // and spans no gap (common practice, no published source: the pick gap is millimetres deep).
    // The first rocker point traced a little low, as noise does, so the hull runs from it toward T.
    const lost: Vec2[] = [[-12, 4], [-9, 6], [-6, 2.5], [-3, 4.5], [-0.2, 0.62], [3.1, 4.1], [5, 3.2], [7.6, 1.63],
      [10.2, 0.05], ...arc(2000, 41, 10.4, 200)]
    expect(isToothTip(lost, 8)).toBe(true)
    expect(() => findSupportHull(lost)).toThrow(/told apart/)
  })

  it('finds the tangent point from B to a circle: √(d² − r²) from B', () => {
    const t = lowerTangentPoint([0, 0], { cx: 40, cy: 2000, r: 2000 })!
    expect(t[0]).toBeCloseTo(40, 9)
    expect(t[1]).toBeCloseTo(0, 9)
    expect(lowerTangentPoint([40, 1], { cx: 40, cy: 2000, r: 2000 })).toBeNull()
  })

  it('refines T between samples on a coarse edge', () => {
    // Rocker sampled every 1 mm with T (x = 40.37) between samples: the hull can only say 40 or 41.
    const work: Vec2[] = [[-6, 1.5], [0, 0], [2, 5], ...arc(1800, 40.37, 5, 150, 1)]
    const hull = findSupportHull(work)
    const refined = refineTouchPoint(work, hull.basePickIndex, work[hull.basePickIndex], work[hull.touchIndex])
    expect(refined.touch[0]).toBeCloseTo(40.37, 6)
    expect(refined.fit!.circle.r).toBeCloseTo(1800, 4)
  })
})

describe('heel end, rocker start and station', () => {
  const rocker = arc(2000, 40, 5, 200)
  const last = rocker[rocker.length - 1]
  const corner: Vec2[] = []
  for (let t = 0; t <= Math.PI / 2 + 1e-9; t += 0.02) corner.push([last[0] + 5 * Math.sin(t), last[1] + 5 - 5 * Math.cos(t)])
  const notch: Vec2[] = [[0, 0], [1, 2], [2, 4], [3, 6], [3.5, 4.5], [4, 3], [4.5, 1.5]]
  const edge = [...notch, ...rocker, ...corner.slice(1)]

  it('measures edge directions from ±0.5 mm chords', () => {
    const ang = directionAngles(arc(1000, 0, -10, 10, 0.05))
    // On a circle the symmetric chord at x has the tangent's direction, atan(x / √(r² − x²)).
    expect(ang[300]).toBeCloseTo(Math.atan(5 / Math.sqrt(1000 ** 2 - 25)), 4)
  })

  it('puts E where the corner passes 45° and the rocker end where the corner starts', () => {
    const ang = directionAngles(edge)
    const tIndex = edge.findIndex((p) => p[0] >= 40)
    const e = findHeelEnd(edge, ang, tIndex)!
    // 45° on the 5 mm corner: x = last + 5 sin 45°, y = last + 5 (1 − cos 45°).
    expect(e.point[0]).toBeCloseTo(last[0] + 5 * Math.SQRT1_2, 1)
    expect(e.point[1]).toBeCloseTo(last[1] + 5 * (1 - Math.SQRT1_2), 1)
    // The rocker ends where the 5 mm corner starts, found to within the ±0.5 mm chord of the direction estimate.
    expect(Math.abs(edge[rockerEndIndex(edge, ang, e.index, tIndex)][0] - last[0])).toBeLessThan(0.6)
    expect(findHeelEnd(rocker, directionAngles(rocker), 100)).toBeNull()
  })

  it('does not take a short bump in the trace for the heel end', () => {
    // A 0.8 mm high, 1.2 mm long glitch at x ≈ 120 turns the direction past 45° for a few tenths of a millimetre.
    const bumped = edge.map((p): Vec2 => (Math.abs(p[0] - 120) < 0.6 ? [p[0], p[1] + 0.8 * (1 - Math.abs(p[0] - 120) / 0.6)] : p))
    const ang = directionAngles(bumped)
    expect(Math.max(...Array.from(ang).filter((_, i) => Math.abs(bumped[i][0] - 120) < 1).map(Math.abs))).toBeGreaterThan(Math.PI / 4)
    const e = findHeelEnd(bumped, ang, bumped.findIndex((p) => p[0] >= 40))!
    expect(e.point[0]).toBeCloseTo(last[0] + 5 * Math.SQRT1_2, 1)
  })

  it('does not take a stretch traced twice (the trace folding back along the rocker) for the heel end', () => {
    // The points run on to x ≈ 101.6, fall back to x ≈ 100 and run on again over the same stretch: for 1.6 mm the
    // direction is ~180° from L, yet the edge does not rise.
    const i0 = edge.findIndex((p) => p[0] >= 100)
    const i1 = edge.findIndex((p) => p[0] >= 101.6)
    const folded = [...edge.slice(0, i1), ...edge.slice(i0, i1).reverse(), ...edge.slice(i0)]
    const e = findHeelEnd(folded, directionAngles(folded), folded.findIndex((p) => p[0] >= 40))!
    expect(e.point[0]).toBeCloseTo(last[0] + 5 * Math.SQRT1_2, 1)
  })

  it('finds the rocker start behind a gentle ramp out of the pick gap as well as behind a steep face', () => {
    // A 30° ramp from the gap's top (3, 4.5) down to the rocker at x = 10: no 45° turn, but a clear corner.
    const ramp: Vec2[] = [[0, 0], [1.5, 2.25], [3, 4.5]]
    const r = arc(1500, 40, 10, 120)
    for (let x = 3.1; x < 10; x += 0.1) ramp.push([x, 4.5 + ((r[0][1] - 4.5) * (x - 3)) / 7])
    const gentle = [...ramp, ...r]
    const ang = directionAngles(gentle)
    const tIndex = gentle.findIndex((p) => p[0] >= 40)
    const start = gentle[rockerStartIndex(gentle, ang, tIndex)][0]
    expect(start).toBeGreaterThan(10)
    expect(start).toBeLessThan(11)
    expect(edge[rockerStartIndex(edge, directionAngles(edge), edge.findIndex((p) => p[0] >= 40))][0]).toBeLessThan(6)
  })

  it('extrapolates along the fitted circle and reads its lower arc', () => {
    const ex = extrapolateStationLift(arc(1500, 40, 5, 180), 180, 200)
    expect(ex.liftMm!).toBeCloseTo(1500 - Math.sqrt(1500 ** 2 - 160 ** 2), 6)
    expect(ex.count).toBeGreaterThan(590)
    const fit = geometricFit(arc(1500, 40, 100, 180))
    expect(lowerArcY(fit.algebraic, 40)!).toBeCloseTo(0, 6)
    expect(lowerArcY(fit.algebraic, 40 + 1600)).toBeNull()
  })
})

describe('radius profile and sections', () => {
  // Toe section 1500 mm to T + 20, then a 2200 mm middle, joined tangentially at x = 60.
  const t = 40
  const toe = arc(1500, t, 5, 60)
  const join = toe[toe.length - 1]
  const slope = (join[0] - t) / Math.sqrt(1500 ** 2 - (join[0] - t) ** 2)
  const cx = join[0] - (2200 * slope) / Math.sqrt(1 + slope * slope)
  const cy = join[1] + 2200 / Math.sqrt(1 + slope * slope)
  const middle: Vec2[] = []
  for (let x = 60.1; x <= 250; x += 0.1) middle.push([x, cy - Math.sqrt(2200 ** 2 - (x - cx) ** 2)])
  const rocker = [...toe, ...middle]

  it('fits 40 mm windows every 5 mm on multiples of 5 mm, wholly on the rocker', () => {
    const prof = radiusProfile(rocker, 5, 250)
    expect(prof[0].alongMm).toBe(25)
    expect(prof[prof.length - 1].alongMm).toBe(230)
    expect(prof.every((w, i) => i === 0 || w.alongMm - prof[i - 1].alongMm === 5)).toBe(true)
    expect(prof.find((w) => w.alongMm === 35)!.radiusMm!).toBeCloseTo(1500, 3)
    expect(prof.find((w) => w.alongMm === 150)!.radiusMm!).toBeCloseTo(2200, 3)
    expect(prof.find((w) => w.alongMm === 150)!.curvaturePerMm).toBeGreaterThan(0)
  })

  it('reports null radius on a straight stretch and one radius per section', () => {
    const straight: Vec2[] = Array.from({ length: 400 }, (_, i): Vec2 => [i * 0.1, 0.3])
    expect(fitWindow(straight, 0, 40)!.radiusMm).toBeNull()
    expect(slice(straight, 1, 2)).toHaveLength(11)
    const sec = sectionRadii(rocker, 5, t, 250)
    expect(sec.toeMm!).toBeCloseTo(1500, 3)
    expect(sec.middleMm!).toBeCloseTo(2200, 3)
    expect(sec.heelMm!).toBeCloseTo(2200, 3)
    expect(sectionRadii(rocker, 5, t, 65).heelMm).toBeNull()
  })
})

describe('flat spots and kinks', () => {
  /** A 2 m rocker with a straight stretch over [from, to], continued tangentially after it. */
  function withFlat(from: number, to: number): Vec2[] {
    const r = 2000
    const pts: Vec2[] = []
    const y = (x: number) => r - Math.sqrt(r * r - x * x)
    const dy = (x: number) => x / Math.sqrt(r * r - x * x)
    for (let x = 0; x <= 250; x += 0.1) {
      if (x < from) pts.push([x, y(x)])
      else if (x <= to) pts.push([x, y(from) + dy(from) * (x - from)])
      else pts.push([x, y(x - (to - from)) + dy(from) * (to - from)])
    }
    return pts
  }

  it('finds a 25 mm flat on a 2 m rocker within about 3 mm of its ends', () => {
    const spots = findFlatSpots(withNoise(withFlat(100, 125), 0.005, 3), 0, 250)
    expect(spots).toHaveLength(1)
    expect(Math.abs(spots[0].fromAlongMm - 100)).toBeLessThan(3)
    expect(Math.abs(spots[0].toAlongMm - 125)).toBeLessThan(3)
    expect(spots[0].radiusMm === null || spots[0].radiusMm > 10_000).toBe(true)
  })

  it('finds no flat spot on a clean 2.4 m rocker with pixel noise, smoothed or not', () => {
    expect(findFlatSpots(withNoise(arc(2400, 40, 0, 250), 0.01, 4), 0, 250, 0.01)).toEqual([])
    // A 5-point smoothed trace: per-point scatter ~0.02 mm but averages behave as 0.044 mm (σ·√τ).
    for (const seed of [1, 2, 3, 4, 5]) {
      const noisy = withSmoothedNoise(arc(2400, 40, 0, 250), 0.044, 5, seed)
      expect(findFlatSpots(noisy, 0, 250, 0.044)).toEqual([])
    }
  })

  it('widens the scan window with the noise and gives up when even 40 mm cannot tell a flat', () => {
    const rocker = arc(2000, 40, 0, 250)
    expect(flatScanWindow(rocker, 0.005)).toBe(20)
    expect(flatScanWindow(rocker, 0.03)).toBeGreaterThan(20)
    expect(flatScanWindow(rocker, 0.2)).toBeNull()
  })

  it('finds a 2° kink and reports its size net of the trend', () => {
    const r = 2000
    const pts = arc(r, 0, 0, 120)
    const [kx, ky] = pts[pts.length - 1]
    const slope = Math.tan(Math.atan(kx / Math.sqrt(r * r - kx * kx)) + (2 * Math.PI) / 180)
    for (let x = 120.1; x <= 250; x += 0.1) pts.push([x, ky + slope * (x - kx) + (x - kx) ** 2 / (2 * r)])
    const kinks = findKinks(withNoise(pts, 0.003, 5), 0, 250, () => 1 / r, 0.003)
    expect(kinks).toHaveLength(1)
    expect(kinks[0].alongMm).toBeCloseTo(120, 0)
    expect(kinks[0].angleDeg).toBeGreaterThan(1.5)
    expect(kinks[0].angleDeg).toBeLessThan(2.3)
  })

  it('reads no kink from pixel noise on a smooth rocker', () => {
    for (const seed of [1, 2, 3]) expect(findKinks(withNoise(arc(2000, 40, 0, 250), 0.02, seed), 0, 250, () => 1 / 2000, 0.02)).toEqual([])
  })
})
