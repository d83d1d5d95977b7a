import { describe, expect, it } from 'vitest'
import { getCv } from '../../../workers/engine/opencv'
import { segmentBlade } from '../../../workers/engine/segment'
import { edgeBlur, lowerPath, refineAlongNormals, sharpOnly, smoothResample, trimExcursions, type EdgeSample } from '../../../workers/engine/trace'
import type { Strip } from '../../../workers/engine/rectify'

const W = 1600
const H = 400
const R = 6000
const CX = 800
const CY = 360 - R

/** Abramowitz & Stegun 7.1.26 approximation of erf (|error| < 1.5e-7). */
function erf(x: number): number {
  const t = 1 / (1 + 0.3275911 * Math.abs(x))
  const y = 1 - (((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t) * Math.exp(-x * x)
  return x >= 0 ? y : -y
}

/**
 * A blade-like silhouette whose lower edge is a circle of radius R px, rendered analytically as a Gaussian-blurred
 * step (sigma 1.3 px) so the true edge is known exactly; the ends are cut off by card-coloured columns.
 */
async function drawnStrip(steel: number, card: number): Promise<Strip> {
  const data = new Uint8Array(W * H)
  const sigma = 1.3
  for (let y = 0; y < H; y++) {
    for (let x = 0; x < W; x++) {
      const d = Math.hypot(x - CX, y - CY) - R
      const inside = x > 150 && x < 1450 ? 0.5 * (1 - erf(d / (sigma * Math.SQRT2))) : 0
      const noise = ((x * 7919 + y * 104729) % 13) / 13 - 0.5
      data[y * W + x] = Math.round(card + (steel - card) * inside + 2 * noise)
    }
  }
  return {
    img: { data, width: W, height: H }, inside: new Uint8Array(W * H).fill(1), shade: new Float32Array(W * H).fill(card),
    tableDepth: new Float32Array(W * H).fill(-1000),
    x0: 0, y0: 0, pxPerMm: 10,
  }
}

describe('edge trace', () => {
  for (const [name, steel, card] of [['dark steel', 90, 210], ['light steel', 245, 150]] as const) {
    it(`locates a circular bottom edge to a few hundredths of a pixel (${name})`, async () => {
      const cv = await getCv()
      const strip = await drawnStrip(steel, card)
      // The arc's lowest point rests on the table line one pixel below it, as a runner rests on the table.
      const sil = segmentBlade(cv, strip, 361)
      expect(sil).not.toBeNull()
      expect(sil!.darker).toBe(steel < card)
      expect(sil!.steelRatio).toBeCloseTo(steel / card, 1)
      const path = lowerPath(sil!.outline)
      const coarse = smoothResample(path, 5, 2)
      const samples = refineAlongNormals(strip, coarse, {
        insidePx: 20, outsidePx: 8, darker: sil!.darker, tableAt: () => false, steelRatio: sil!.steelRatio, shadeAt: () => card,
      })
      // Only the arc, away from the drawn vertical ends: distance to the true circle of radius R (pixel centres).
      const errors = samples
        .filter((s) => s.p[0] > 170 && s.p[0] < 1430)
        .map((s) => Math.hypot(s.p[0] - CX, s.p[1] - CY) - R)
      expect(errors.length).toBeGreaterThan(500)
      const mean = errors.reduce((a, b) => a + b, 0) / errors.length
      const rms = Math.sqrt(errors.reduce((a, b) => a + b * b, 0) / errors.length)
      expect(Math.abs(mean)).toBeLessThan(0.03)
      expect(rms).toBeLessThan(0.06)
    }, 60_000)
  }
})

describe('soft samples', () => {
  it('drops the shadow outlines, and a sample with no blur to read cannot make it drop every sample', () => {
    // Along a smooth edge the blur changes slowly, so neighbouring samples come nearly in order.
    const samples: EdgeSample[] = [1.0, 1.1, 1.15, 1.2, 1.3, 4.5].map((sigma, i) => ({ p: [i, 0], strength: 50, sigma }))
    // One profile ran off the strip: its blur is NaN, wherever it comes (in the middle a sort leaves it in place).
    for (const at of [0, 3, 6]) {
      const withNaN = [...samples]
      withNaN.splice(at, 0, { p: [9, 0], strength: 50, sigma: NaN })
      const kept = sharpOnly(withNaN)
      expect(kept.map((s) => s.sigma)).toEqual([1.0, 1.1, 1.15, 1.2, 1.3])
    }
  })
})

describe('edge blur from a profile across the edge', () => {
  // A straight edge blurred by a Gaussian of sigma σ has the profile S + h·Φ((s − e)/σ), whose steepest slope is
  // h / (σ√(2π)) (any probability text: the normal density's peak is 1/(σ√(2π))); the blur is read back from the
  // slope and the step. A wide blur must read as wide: read 3 px out, a 6 px blur would show 40 % of its step.
  function blurredStep(sigma: number): { profile: Float64Array; peakAt: number; peak: number } {
    const n = 161
    const profile = new Float64Array(n)
    for (let k = 0; k < n; k++) profile[k] = 40 + 150 * 0.5 * (1 + erf((k - 80.3) / (sigma * Math.SQRT2)))
    let peakAt = 1
    for (let k = 1; k < n - 1; k++) if (profile[k + 1] - profile[k - 1] > profile[peakAt + 1] - profile[peakAt - 1]) peakAt = k
    return { profile, peakAt, peak: (profile[peakAt + 1] - profile[peakAt - 1]) / 2 }
  }
  for (const sigma of [3, 6, 10]) {
    it(`reads back a blur of ${sigma} px within 6 %`, () => {
      const { profile, peakAt, peak } = blurredStep(sigma)
      expect(Math.abs(edgeBlur(profile, peakAt, peak) / sigma - 1)).toBeLessThan(0.06)
    })
  }
  it('reads a sharp edge as sharp: a 2 px central difference flattens the slope, so it errs a little wide', () => {
    for (const sigma of [0.8, 1.5]) {
      const { profile, peakAt, peak } = blurredStep(sigma)
      const read = edgeBlur(profile, peakAt, peak)
      expect(read).toBeGreaterThanOrEqual(sigma)
      expect(read).toBeLessThan(1.35 * sigma)
    }
  })
})

describe('trimExcursions', () => {
  type P = [number, number]
  // A lower path in strip px (v down, table at v = 300): a boot's sole running right high up, its return down the
  // blade's front, then toe-pick teeth raked forward (each tip 15 px ahead of the notch before it) and the rocker.
  const boot: P[] = Array.from({ length: 40 }, (_, i) => [100 + 4 * i, 60])
  const front: P[] = Array.from({ length: 20 }, (_, i) => [260 - 4 * i, 60 + 6 * i])
  const teeth: P[] = [[180, 200], [200, 230], [185, 240], [205, 270], [190, 280], [215, 300]]
  const rocker: P[] = Array.from({ length: 120 }, (_, i) => [220 + 10 * i, 300])
  const path = [...boot, ...front, ...teeth, ...rocker]

  it('cuts the boot off where the outline steps back high above the table', () => {
    const kept = trimExcursions(path, 10, 300 - 20 * 10)
    expect(kept[0][1]).toBeGreaterThan(60)
    expect(kept.some(([u, v]) => u === 190 && v === 280)).toBe(true)
  })

  it('keeps raked toe-pick teeth near the table, which a trim on every step back would cut away', () => {
    expect(trimExcursions(path, 10)).not.toContainEqual([185, 240])
    const kept = trimExcursions(path, 10, 300 - 20 * 10)
    for (const tooth of teeth) expect(kept).toContainEqual(tooth)
  })
})
