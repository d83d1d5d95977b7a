import { describe, expect, it } from 'vitest'
import { douglasPeucker, restoreTips } from '../../../workers/engine/tips'
import { moveAllowanceMm } from '../../../workers/engine/tooth-tips'

type Pt = [number, number]

/** Points every `step` mm along a polyline. */
function sampled(corners: Pt[], step = 0.25): Pt[] {
  const out: Pt[] = []
  for (let k = 0; k + 1 < corners.length; k++) {
    const [a, b] = [corners[k], corners[k + 1]]
    const n = Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / step)
    for (let i = 0; i < n; i++) out.push([a[0] + ((b[0] - a[0]) * i) / n, a[1] + ((b[1] - a[1]) * i) / n])
  }
  out.push(corners[corners.length - 1])
  return out
}

describe('restoring the toe picks\u2019 tips', () => {
  // A tooth pointing down (card y down): front face from (0, 0) to the tip at (1.5, 5.5), rear face up to (4.5, 1.5),
  // then a long rocker-like run. Its last 0.7 mm either side of the tip is cut away, as blur and segmentation do.
  const tip: Pt = [1.5, 5.5]
  const full = sampled([[0, 0], tip, [4.5, 1.5], [40, 2.5]])
  const cut = full.filter((p) => Math.hypot(p[0] - tip[0], p[1] - tip[1]) > 0.7)

  it('puts a lost tip back where its straight faces meet', () => {
    const restored = restoreTips(cut)
    const lowest = restored.reduce((a, b) => (b[1] > a[1] ? b : a))
    // Exact geometry: the faces are straight lines through the tip, so their intersection is the tip.
    expect(lowest[0]).toBeCloseTo(tip[0], 6)
    expect(lowest[1]).toBeCloseTo(tip[1], 6)
  })

  it('treats a face traced with a slight bend as one face', () => {
    // The front face wavers by a tenth of a millimetre every 1.4 mm, as a trace does near a blurred tip: cut into
    // pieces too short to fit once their ends are trimmed, only the joined face rebuilds the tip (0.75 mm off without).
    const bent = sampled([[0.3, 0], [0.85, 1.4], [0.88, 2.8], [1.35, 4.2], tip, [4.5, 1.5], [40, 2.5]])
    const restored = restoreTips(bent.filter((p) => Math.hypot(p[0] - tip[0], p[1] - tip[1]) > 0.7))
    const lowest = restored.reduce((a, b) => (b[1] > a[1] ? b : a))
    expect(Math.hypot(lowest[0] - tip[0], lowest[1] - tip[1])).toBeLessThan(0.25)
  })

  it('leaves an edge without corners alone', () => {
    const smooth = sampled([[0, 0], [40, 2]])
    expect(restoreTips(smooth)).toEqual(smooth)
  })

  it('keeps a tip that is already sharp', () => {
    const restored = restoreTips(full)
    expect(restored.some((p) => Math.hypot(p[0] - tip[0], p[1] - tip[1]) < 1e-9)).toBe(true)
  })

  it('simplifies a polyline to its corners (Douglas–Peucker)', () => {
    const pts = sampled([[0, 0], [10, 0], [10, 10]], 0.5)
    expect(douglasPeucker(pts, 0, pts.length - 1, 0.01).map((i) => pts[i])).toEqual([[0, 0], [10, 0], [10, 10]])
  })
})

describe('how far the tip model may move a tip', () => {
  type Pt = [number, number]
  // A traced tip: its neighbours a quarter millimetre away (card mm, y down).
  const traced: Pt[] = [[-0.1, -0.25], [0, 0], [0.15, -0.2]]
  // A tip rebuilt where curved faces meet, 1.8 mm beyond the trace on either side.
  const rebuilt: Pt[] = [[-0.2, -1.1], [0.2, 0.7], [1.8, -1.4]]

  it('keeps a traced tip within 0.45 mm', () => {
    expect(moveAllowanceMm(traced, 1, traced[1], [0, -0.3])).toBeCloseTo(0.45, 9)
  })

  it('lets a rebuilt tip come back toward the trace by up to 0.5 mm more, but not go farther out', () => {
    expect(moveAllowanceMm(rebuilt, 1, rebuilt[1], [0.05, -0.1])).toBeCloseTo(0.95, 9)
    expect(moveAllowanceMm(rebuilt, 1, rebuilt[1], [0.2, 1.2])).toBeCloseTo(0.45, 9)
  })
})
