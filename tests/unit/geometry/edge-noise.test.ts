import { describe, expect, it } from 'vitest'
import { measureEdgeNoise } from '../../../shared/geometry/edge-noise'
import type { Vec2 } from '../../../shared/geometry/vec'
import { withNoise, withSmoothedNoise } from './helpers'

const rocker: Vec2[] = Array.from({ length: 2500 }, (_, i): Vec2 => [i * 0.1, (i * 0.1 - 40) ** 2 / 4000])

describe('edge noise', () => {
  it('measures independent noise with τ = 1', () => {
    const n = measureEdgeNoise(withNoise(rocker, 0.02, 1))
    expect(n.sigmaMm).toBeCloseTo(0.02, 2)
    expect(n.tau).toBeLessThan(1.3)
  })
  it('sees a 5-point moving average as τ ≈ 5, so σ·√τ recovers the noise averages feel', () => {
    // A w-point moving average of white noise has autocorrelation (w − k)/w, whose integral 1 + 2Σρₖ is w.
    const n = measureEdgeNoise(withSmoothedNoise(rocker, 0.02, 5, 2))
    expect(n.tau).toBeGreaterThan(3.8)
    expect(n.tau).toBeLessThan(5.5)
    // Averaging-equivalent noise is the raw 0.02/√2 per coordinate projected on the normal: 0.02 per point.
    expect(n.sigmaMm * Math.sqrt(n.tau)).toBeGreaterThan(0.016)
    expect(n.sigmaMm * Math.sqrt(n.tau)).toBeLessThan(0.022)
  })
  it('reports nothing measurable on a too-short rocker', () => {
    expect(measureEdgeNoise(rocker.slice(0, 15))).toEqual({ sigmaMm: 0, tau: 1 })
  })
})
