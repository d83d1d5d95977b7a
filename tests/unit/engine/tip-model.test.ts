import { describe, expect, it } from 'vitest'
import { fitTipModel, wedgeShare } from '../../../workers/engine/tip-model'
import type { GreyImage } from '../../../workers/engine/image'

type Pt = [number, number]

interface Scene {
  tip: Pt
  slopes: [number, number]
  /** Card above this height, table below it (v down); null = card everywhere. */
  cardEdgeV: number | null
  levels: { steel: number; card: number; table: number }
}

function insideWedge(s: Scene, u: number, v: number): boolean {
  const dv = v - s.tip[1]
  if (dv > 0) return false
  const a = s.tip[0] + s.slopes[0] * dv
  const b = s.tip[0] + s.slopes[1] * dv
  return u >= Math.min(a, b) && u <= Math.max(a, b)
}

/**
 * An independent rendering of the scene: point samples on a grid 8 × finer than the pixels, blurred by a sampled
 * Gaussian (separable convolution), read at the pixel centres, plus a fixed pseudo-random grain.
 */
function render(s: Scene, size: number, sigma: number): GreyImage {
  const k = 8
  const n = size * k
  const fine = new Float64Array(n * n)
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const [u, v] = [(i + 0.5) / k - 0.5, (j + 0.5) / k - 0.5]
      const below = s.cardEdgeV !== null && v > s.cardEdgeV
      fine[j * n + i] = insideWedge(s, u, v) ? s.levels.steel : below ? s.levels.table : s.levels.card
    }
  }
  const radius = Math.ceil(4 * sigma * k)
  const kernel = Array.from({ length: 2 * radius + 1 }, (_, t) => Math.exp(-0.5 * ((t - radius) / (sigma * k)) ** 2))
  const total = kernel.reduce((a, b) => a + b, 0)
  const blurAlong = (src: Float64Array, horizontal: boolean): Float64Array => {
    const out = new Float64Array(n * n)
    for (let j = 0; j < n; j++) {
      for (let i = 0; i < n; i++) {
        let sum = 0
        for (let t = -radius; t <= radius; t++) {
          const [ii, jj] = horizontal ? [Math.min(n - 1, Math.max(0, i + t)), j] : [i, Math.min(n - 1, Math.max(0, j + t))]
          sum += kernel[t + radius] * src[jj * n + ii]
        }
        out[j * n + i] = sum / total
      }
    }
    return out
  }
  const blurred = blurAlong(blurAlong(fine, true), false)
  const data = new Uint8Array(size * size)
  let seed = 7
  for (let v = 0; v < size; v++) {
    for (let u = 0; u < size; u++) {
      // The pixel centre (u, v) lies between fine samples k·u + k/2 − 1 and k·u + k/2.
      const [i, j] = [u * k + k / 2, v * k + k / 2]
      const value = (blurred[j * n + i] + blurred[j * n + i - 1] + blurred[(j - 1) * n + i] + blurred[(j - 1) * n + i - 1]) / 4
      seed = (seed * 16807) % 2147483647
      data[v * size + u] = Math.round(Math.min(255, Math.max(0, value + 4 * (seed / 2147483647 - 0.5))))
    }
  }
  return { data, width: size, height: size }
}

describe('blurred wedge share', () => {
  it('gives the angle over a full turn at the apex', () => {
    // An isotropic Gaussian puts the share θ / 2π of its mass in a wedge of angle θ at its centre (its rotational
    // symmetry; any probability text on the bivariate normal).
    const slopes: [number, number] = [-0.5, 1.2]
    const angle = Math.atan(1.2) + Math.atan(0.5)
    expect(wedgeShare(10, 10, [10, 10], slopes, 1.3, 10)).toBeCloseTo(angle / (2 * Math.PI), 4)
  })

  it('splits into two independent normal shares for a right-angled wedge', () => {
    // Slopes ±1 make a right angle; in axes along its faces the Gaussian's two coordinates are independent standard
    // normals, so the share is Φ(a)·Φ(b) with a, b the distances to the faces over σ (bivariate normal independence).
    const [u, v, s] = [10.7, 9.4, 1.1]
    const d1 = ((u - 10) + (v - 10)) / Math.SQRT2 // distance inside the face u = 10 − (v − 10)
    const d2 = ((10 - u) + (v - 10)) / Math.SQRT2 // ... and the face u = 10 + (v − 10)
    const phi = (x: number): number => {
      // Standard normal CDF by direct Simpson integration of the density, independent of the engine's erf.
      const n = 2000
      const lo = -10
      const h = (x - lo) / n
      let sum = 0
      for (let i = 0; i <= n; i++) sum += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * Math.exp(-0.5 * (lo + i * h) ** 2)
      return (sum * h) / 3 / Math.sqrt(2 * Math.PI)
    }
    expect(wedgeShare(u, v, [10, 10], [-1, 1], s, 10)).toBeCloseTo(phi(-d1 / s) * phi(-d2 / s), 4)
  })
})

describe('tooth tip fitted on a model of the blurred scene', () => {
  const base: Scene = { tip: [30.3, 30.6], slopes: [-0.2, 0.85], cardEdgeV: null, levels: { steel: 70, card: 225, table: 110 } }

  const cases: [string, Scene][] = [
    ['against the card alone', base],
    ['with the card\u2019s bottom edge running just past the tip', { ...base, cardEdgeV: 31.4 }],
    ['with the tip reaching below the card\u2019s bottom edge onto the table', { ...base, cardEdgeV: 29.2 }],
    ['with steel lighter than card and table', { ...base, cardEdgeV: 32.5, levels: { steel: 200, card: 120, table: 60 } }],
  ]
  for (const [name, scene] of cases) {
    it(`finds the tip to a tenth of a pixel ${name}`, () => {
      const img = render(scene, 60, 1.3)
      // A start 1.5 px off and the faces 5° off, as the traced faces' extension gives.
      const fit = fitTipModel({
        img, tip: [scene.tip[0] + 1, scene.tip[1] - 1.1], slopes: [-0.3, 0.75], sigma: 1, radius: 10,
        cardEdgeV: scene.cardEdgeV === null ? null : scene.cardEdgeV + 0.8,
      })
      expect(fit).not.toBeNull()
      const f = fit as NonNullable<typeof fit>
      expect(Math.hypot(f.tip[0] - scene.tip[0], f.tip[1] - scene.tip[1])).toBeLessThan(0.1)
      expect(f.sigma).toBeCloseTo(1.3, 1)
      // The smaller of steel-to-card and steel-to-table (40 levels in the cases with the table in the patch).
      expect(f.contrast).toBeGreaterThan(30)
    })
  }

  it('declines a patch too small to hold a tooth', () => {
    const img = render(base, 60, 1.3)
    expect(fitTipModel({ img, tip: base.tip, slopes: base.slopes, sigma: 1.3, radius: 3, cardEdgeV: null })).toBeNull()
  })
})
