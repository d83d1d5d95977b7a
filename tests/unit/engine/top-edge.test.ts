/**
 * The runner's top edge: on drawn strips whose edges are known exactly (sub-pixel location, and the cases where it
 * must say nothing), then on generated photos against the truth of their construction (tests/bench/runner-height-score.ts).
 */
import { describe, expect, it } from 'vitest'
import { getCv } from '../../../workers/engine/opencv'
import { smoothed } from '../../../workers/engine/segment'
import { traceTopEdge } from '../../../workers/engine/top-edge'
import { recomputeFromEdge } from '../../../shared/geometry/stored-result'
import { resultOf } from '../../factories/analysis-results'
import type { Strip } from '../../../workers/engine/rectify'
import type { Pt } from '../../../workers/engine/projective'
import { quantile } from '../../bench/evaluate'
import { scoreRunnerHeight, type RunnerHeightScore } from '../../bench/runner-height-score'

const R = 4 // strip px per mm, as the engine rectifies a 3 MP photo
const W = 300 * R
const H = 60 * R
const BOTTOM_MM = 55 // card y of the running surface (the strip starts at card y 0)

interface Drawing {
  steel: number
  card: number
  /** Height of the top edge above the running surface at card x, mm; a tilt of 0.5° is drawn in. */
  runnerMm: number
  /** What covers the card above the top edge between these card x (a boot hanging low), and its brightness. */
  boot?: { from: number; to: number; level: number }
}

/** Top edge (card y) at card x: the runner's top, or a plate's top over the toe and heel plates. */
function topAt(d: Drawing, x: number): number {
  const plate = (x > 20 && x < 95) || (x > 205 && x < 255)
  return BOTTOM_MM - d.runnerMm - 0.0087 * (x - 150) - (plate ? 16 : 0)
}

/** A rectified strip of a runner from card x 20 to 290 with plates, 4 × 4 supersampled, blurred by σ 1.2 px, noisy. */
async function drawnStrip(d: Drawing): Promise<Strip> {
  const cv = await getCv()
  const data = new Uint8Array(W * H)
  for (let v = 0; v < H; v++) {
    for (let u = 0; u < W; u++) {
      let sum = 0
      for (let k = 0; k < 16; k++) {
        const x = (u + ((k % 4) + 0.5) / 4 - 0.5) / R
        const y = (v + (Math.floor(k / 4) + 0.5) / 4 - 0.5) / R
        const inRunner = x > 20 && x < 290 && y < BOTTOM_MM && y >= topAt(d, x)
        const above = d.boot && x > d.boot.from && x < d.boot.to ? d.boot.level : d.card
        sum += inRunner ? d.steel : y < BOTTOM_MM ? above : d.card
      }
      data[v * W + u] = Math.round(sum / 16)
    }
  }
  const strip: Strip = {
    img: { data, width: W, height: H }, inside: new Uint8Array(W * H).fill(1), shade: new Float32Array(W * H).fill(d.card),
    tableDepth: new Float32Array(W * H).fill(-1000),
    x0: 0, y0: 0, pxPerMm: R,
  }
  const blurred = smoothed(cv, strip, 1.2)
  for (let i = 0; i < blurred.length; i++) blurred[i] = Math.max(0, Math.min(255, blurred[i] + 2 * ((((i % W) * 7919 + Math.floor(i / W) * 104729) % 13) / 13 - 0.5)))
  return { ...strip, img: { data: blurred, width: W, height: H } }
}

/** The traced bottom edge the search starts from: the running surface, toe on the left. */
const bottom: Pt[] = Array.from({ length: 1081 }, (_, i): Pt => [20 + i * 0.25, BOTTOM_MM])

describe('top edge on drawn strips', () => {
  for (const [name, steel, card] of [['dark steel', 95, 215], ['light steel', 240, 150]] as const) {
    it(`finds the runner's top edge between the plates to a few hundredths of a millimetre (${name})`, async () => {
      const d = { steel, card, runnerMm: 26 }
      const top = traceTopEdge(await drawnStrip(d), bottom, 4)
      expect(top).not.toBeNull()
      const pts = top!.stretchesMm.flat()
      // Between the plates (95–205 mm, less the column walk's margins) and behind the heel plate (255–290 mm).
      expect(pts.filter((p) => p[0] > 100 && p[0] < 200).length).toBeGreaterThan(180)
      expect(pts.every((p) => (p[0] > 95 && p[0] < 205) || p[0] > 255)).toBe(true)
      const errors = pts.map((p) => p[1] - topAt(d, p[0]))
      const mean = errors.reduce((a, b) => a + b, 0) / errors.length
      expect(Math.abs(mean)).toBeLessThan(0.02)
      expect(quantile(errors.map(Math.abs), 0.95)).toBeLessThan(0.05)
      expect(top!.sigmaMm).toBeCloseTo(0.25, 10) // the 1 px systematic floor at 4 photo px per mm
    }, 60_000)
  }

  it('says nothing when a boot, not card, lies above the edge between the plates', async () => {
    const d = { steel: 240, card: 150, runnerMm: 26, boot: { from: 90, to: 210, level: 40 } }
    expect(traceTopEdge(await drawnStrip(d), bottom, 4)).toBeNull()
  }, 60_000)

  it('says nothing when the steel ends lower than a runner\u2019s top edge can be', async () => {
    expect(traceTopEdge(await drawnStrip({ steel: 95, card: 215, runnerMm: 11 }), bottom, 4)).toBeNull()
  }, 60_000)
})

describe('runner height recomputed from a stored result', () => {
  const blade = { sizeIn: 10, discipline: 'freestyle' as const }

  it('reads the stored top edge again in the frame of the moved landmarks, and leaves older results without it', () => {
    const stored = resultOf({ topEdgeAboveLMm: 24 })
    const same = recomputeFromEdge(stored, null, blade)
    // The geometry finds B and T on the stored edge itself; the heights agree with the fixture's to a few microns.
    expect(same.runnerHeights!.map((s) => s.alongMm)).toEqual(stored.runnerHeights!.map((s) => s.alongMm))
    same.runnerHeights!.forEach((s, i) => expect(Math.abs(s.heightMm - stored.runnerHeights![i].heightMm)).toBeLessThan(0.01))
    // B moved 5 mm toward the heel: every station is read 5 mm further along the blade than before, so the moved
    // 100 mm station lies half-way between the first's 100 and 110 (the height is straight to 6 µm over 10 mm there).
    const moved = recomputeFromEdge(stored, { basePickAlongMm: 5 }, blade)
    const at = (r: typeof same, x: number) => r.runnerHeights!.find((s) => s.alongMm === x)!.heightMm
    expect(Math.abs(at(moved, 100) - (at(same, 100) + at(same, 110)) / 2)).toBeLessThan(0.02)
    expect(Math.abs(at(moved, 100) - at(same, 100))).toBeGreaterThan(0.05)
    const older = recomputeFromEdge(resultOf(), null, blade)
    expect('topEdge' in older || 'runnerHeights' in older).toBe(false)
  })
})

describe('runner height on generated photos', () => {
  it('measures the runner height where the top edge shows, against the truth of the photo\u2019s construction', async () => {
    // Seeds the engine measures today, at 3 MP and one at 12 MP; the truth is read in the engine's own blade frame.
    const scores: RunnerHeightScore[] = []
    for (const seed of [1006, 1007, 1008, 1009, 1011]) scores.push(await scoreRunnerHeight(seed, '3mp'))
    scores.push(await scoreRunnerHeight(1009, '12mp'))
    const measured = scores.filter((s) => s.stations.length > 0)
    console.info(scores.map((s) => `${s.seed}/${s.resolution}: ${s.refused ?? `${s.stations.length} stations`}`).join('; '))
    expect(measured.length).toBeGreaterThanOrEqual(4)
    const stations = measured.flatMap((s) => s.stations)
    // No station where the true top edge is not (between the plates, or behind the heel plate).
    expect(stations.filter((s) => s.trueMm === null)).toEqual([])
    const errors = stations.map((s) => Math.abs(s.measuredMm - s.trueMm!))
    console.info(`runner height |error|: median ${quantile(errors, 0.5).toFixed(3)} mm, 90 % ${quantile(errors, 0.9).toFixed(3)} mm`)
    // Our bars (no published source): a 3 MP photo resolves about 0.25 mm a pixel; the median error stays under half
    // a pixel and nine in ten under a pixel, and the reported ± holds the truth at nine stations in ten (DESIGN §4.7).
    expect(quantile(errors, 0.5)).toBeLessThan(0.1)
    expect(quantile(errors, 0.9)).toBeLessThan(0.25)
    expect(stations.filter((s) => Math.abs(s.measuredMm - s.trueMm!) <= s.plusMinusMm).length / stations.length).toBeGreaterThanOrEqual(0.9)
  }, 300_000)
})
