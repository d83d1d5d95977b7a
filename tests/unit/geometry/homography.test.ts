import { describe, expect, it } from 'vitest'
import {
  applyHomography,
  fitHomography,
  fitHomographyRobust,
  invertHomography,
  normaliseHomography,
  reprojectionRms,
} from '../../../shared/geometry/homography'
import type { Vec2 } from '../../../shared/geometry/vec'

function expectMatrix(actual: number[][], expected: number[][], digits = 9) {
  actual.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(expected[i][j], digits)))
}

describe('normalised DLT (Hartley & Zisserman, alg. 4.2)', () => {
  it('reproduces H = [[1, −0.25, 0.25], [0, 1, 0], [0, 0, 1]]', () => {
    // REFERENCES.md: point data from a published getPerspectiveTransform example, H verified by hand.
    const src: Vec2[] = [[1, 1], [2, 5], [6, 5], [5, 1]]
    const dst: Vec2[] = [[1, 1], [1, 5], [5, 5], [5, 1]]
    expectMatrix(fitHomography(src, dst), [[1, -0.25, 0.25], [0, 1, 0], [0, 0, 1]])
  })

  it('maps the unit square onto (0,0),(3,0),(2,1),(1,1) with H ∝ [[3,3,0],[0,3,0],[0,2,1]]', () => {
    // REFERENCES.md: computed by hand; (0.5, 0.5) → (1.5, 0.75).
    const h = fitHomography([[0, 0], [1, 0], [1, 1], [0, 1]], [[0, 0], [3, 0], [2, 1], [1, 1]])
    expectMatrix(h, [[3, 3, 0], [0, 3, 0], [0, 2, 1]])
    const p = applyHomography(h, [0.5, 0.5])
    expect(p[0]).toBeCloseTo(1.5, 10)
    expect(p[1]).toBeCloseTo(0.75, 10)
  })

  it('round-trips through its inverse and fits many noisy points with the noise as residual', () => {
    const truth = [[8.1, 0.4, 300], [-0.3, 7.9, 200], [1e-4, -2e-4, 1]]
    const card: Vec2[] = []
    for (let x = 0; x <= 280; x += 40) for (let y = 0; y <= 180; y += 45) card.push([x, y])
    let seed = 3
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5
    const photo = card.map((p): Vec2 => {
      const q = applyHomography(truth, p)
      return [q[0] + rnd() * 0.4, q[1] + rnd() * 0.4]
    })
    const h = fitHomography(card, photo)
    expect(reprojectionRms(h, card, photo)).toBeLessThan(0.2)
    const back = applyHomography(invertHomography(h), applyHomography(h, [123, 45]))
    expect(back[0]).toBeCloseTo(123, 8)
    expect(back[1]).toBeCloseTo(45, 8)
  })

  it('rejects fewer than four pairs and scales to h33 = 1', () => {
    expect(() => fitHomography([[0, 0], [1, 0], [1, 1]], [[0, 0], [1, 0], [1, 1]])).toThrow(RangeError)
    expect(normaliseHomography([[2, 0, 0], [0, 2, 0], [0, 0, 2]])[2][2]).toBe(1)
  })
})

describe('robust homography', () => {
  it('ignores gross outliers that would ruin a plain DLT', () => {
    const truth = [[10, 0.5, 100], [0.2, 9.5, 50], [2e-4, 1e-4, 1]]
    const card: Vec2[] = []
    for (let x = 0; x <= 200; x += 25) for (let y = 0; y <= 100; y += 25) card.push([x, y])
    const photo = card.map((p) => applyHomography(truth, p))
    const outliers = [3, 11, 20, 31]
    for (const i of outliers) photo[i] = [photo[i][0] + 80, photo[i][1] - 60]
    const robust = fitHomographyRobust(card, photo, { thresholdDst: 2 })
    expect(robust.inliers).toHaveLength(card.length - outliers.length)
    expect(robust.inliers.some((i) => outliers.includes(i))).toBe(false)
    expect(robust.rms).toBeLessThan(1e-6)
    expect(reprojectionRms(fitHomography(card, photo), card, photo)).toBeGreaterThan(5)
  })
})
