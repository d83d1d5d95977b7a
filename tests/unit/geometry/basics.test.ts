import { describe, expect, it } from 'vitest'
import { inverse, matMul, solve, symmetricEigen, transpose } from '../../../shared/geometry/linalg'
import { lowerHull } from '../../../shared/geometry/hull'
import { bladeFrameFromCard, bladeToCard, cardToBlade, cardToWork, workToCard } from '../../../shared/geometry/frames'
import { centroid, cross, degToRad, interpolateY, median, radToDeg, rotate, unit } from '../../../shared/geometry/vec'
import type { Vec2 } from '../../../shared/geometry/vec'

describe('vec', () => {
  it('rotates counter-clockwise in a y-up frame and converts angles', () => {
    const r = rotate([1, 0], Math.PI / 2)
    expect(r[0]).toBeCloseTo(0, 12)
    expect(r[1]).toBeCloseTo(1, 12)
    expect(cross([1, 0], [0, 1])).toBe(1)
    expect(radToDeg(degToRad(45))).toBeCloseTo(45, 12)
  })
  it('gives centroid, median, unit and interpolation', () => {
    expect(centroid([[0, 0], [2, 4]])).toEqual([1, 2])
    expect(median([5, 1, 3, 2])).toBe(2.5)
    expect(unit([3, 4])).toEqual([0.6, 0.8])
    expect(() => unit([0, 0])).toThrow(RangeError)
    expect(interpolateY([[0, 0], [10, 5]], 4)).toBeCloseTo(2, 12)
    expect(interpolateY([[0, 0], [10, 5]], 11)).toBeNull()
  })
})

describe('linalg', () => {
  it('solves, inverts and reports singular systems', () => {
    const a = [[4, 1, 2], [1, 3, 0], [2, 0, 5]]
    const x = solve(a, [1, 2, 3])!
    const back = matMul(a, x.map((v) => [v])).map((r) => r[0])
    back.forEach((v, i) => expect(v).toBeCloseTo([1, 2, 3][i], 12))
    const inv = inverse(a)!
    matMul(a, inv).forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(i === j ? 1 : 0, 12)))
    expect(solve([[1, 2], [2, 4]], [1, 2])).toBeNull()
  })
  it('finds eigenpairs of a symmetric matrix (A v = λ v on a matrix with eigenvalues 1, 3, 4)', () => {
    // [[2,1,0],[1,2,0],[0,0,4]] has eigenvalues 1, 3, 4 (by hand: the 2×2 block gives 2 ± 1).
    const a = [[2, 1, 0], [1, 2, 0], [0, 0, 4]]
    const { values, vectors } = symmetricEigen(a)
    expect(values.map((v) => Number(v.toFixed(10)))).toEqual([1, 3, 4])
    vectors.forEach((v, k) => {
      const av = matMul(a, v.map((x) => [x])).map((r) => r[0])
      av.forEach((x, i) => expect(x).toBeCloseTo(values[k] * v[i], 10))
    })
    expect(transpose([[1, 2, 3]])).toEqual([[1], [2], [3]])
  })
})

describe('lower hull', () => {
  it('keeps the chain a straight edge from below touches, ordered by x', () => {
    const pts: Vec2[] = [[0, 3], [1, 1], [2, 2], [3, 0], [4, 0.5], [5, 4], [2.5, 5]]
    expect(lowerHull(pts).map((i) => pts[i])).toEqual([[0, 3], [1, 1], [3, 0], [4, 0.5], [5, 4]])
  })
  it('drops collinear interior points', () => {
    const pts: Vec2[] = [[0, 0], [1, 0], [2, 0], [1, 1]]
    expect(lowerHull(pts)).toEqual([0, 2])
  })
})

describe('frames', () => {
  it('puts B at the origin, T on +x and the table side at −y, for either toe side', () => {
    for (const [b, t] of [[[30, 170], [70, 171]], [[300, 170], [260, 171]]] as [Vec2, Vec2][]) {
      const f = bladeFrameFromCard(b, t)
      const tb = cardToBlade(f, t)
      expect(tb[0]).toBeCloseTo(Math.hypot(t[0] - b[0], t[1] - b[1]), 10)
      expect(tb[1]).toBeCloseTo(0, 10)
      // A point 5 mm toward the table (card +y) is below L: negative height.
      expect(cardToBlade(f, [t[0], t[1] + 5])[1]).toBeLessThan(0)
      const p: Vec2 = [123, 45]
      const back = bladeToCard(f, cardToBlade(f, p))
      expect(back[0]).toBeCloseTo(123, 10)
      expect(back[1]).toBeCloseTo(45, 10)
    }
  })
  it('maps card ↔ work frame for a toe on the right by mirroring x and flipping y', () => {
    expect(cardToWork('right', [10, 20])).toEqual([-10, -20])
    expect(workToCard('right', cardToWork('right', [10, 20]))).toEqual([10, 20])
  })
})
