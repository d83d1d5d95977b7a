import { describe, expect, it } from 'vitest'
import { dropStrayRuns } from '../../../workers/engine/clean'

type Pt = [number, number]

/** Points every `step` mm along the segment a → b, a included, b not. */
function along(a: Pt, b: Pt, step: number): Pt[] {
  const n = Math.round(Math.hypot(b[0] - a[0], b[1] - a[1]) / step)
  return Array.from({ length: n }, (_, k) => [a[0] + ((b[0] - a[0]) * k) / n, a[1] + ((b[1] - a[1]) * k) / n] as Pt)
}

describe('stray runs in a traced edge', () => {
  // A tooth: its front face down to the tip at (0, 0) (card frame, y down), its rear face back up, then the rocker.
  const front = along([-1, -4], [0, 0], 0.25)
  const rear = along([0, 0], [1.2, -1.4], 0.25)
  const rocker = along([1.2, -1.4], [12, -1.4], 0.25)

  it('drops a short run cut off by jumps, as a search that found another face leaves', () => {
    const stray = along([5, -5], [5.6, -5], 0.25)
    const kept = dropStrayRuns([...front, ...rear, ...stray, ...rocker], 0.8, 1.5)
    expect(kept).toEqual([...front, ...rear, ...rocker])
  })

  it('keeps a tooth tip that a single stray point would have cut off into a short run', () => {
    // The lone stray between the front face's last point and the tip: without it the tip and the start of the rear
    // face are one run with the rest; with it, the tip's run is shorter than 1.5 mm.
    const tipRun = along([0, 0], [0.6, -0.7], 0.25)
    const afterHole = along([1.6, -1.4], [12, -1.4], 0.25)
    const edge = [...front, [3.2, -4.7] as Pt, ...tipRun, ...afterHole]
    const kept = dropStrayRuns(edge, 0.8, 1.5)
    expect(kept).toContainEqual([0, 0])
    expect(kept).not.toContainEqual([3.2, -4.7])
  })
})
