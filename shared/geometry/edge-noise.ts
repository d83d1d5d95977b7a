import { solve } from './linalg'
import type { Vec2 } from './vec'
import { median } from './vec'

/** Noise of a traced edge as measured on its own rocker. */
export interface EdgeNoise {
  /** RMS scatter of the points about a smooth local curve (mm). */
  sigmaMm: number
  /**
   * Integrated autocorrelation of that scatter, in points (≥ 1): 1 for independent points; about w after a
   * w-point moving average. Averages over n points shrink noise as √(τ/n), not √(1/n).
   */
  tau: number
}

/** Residuals of a least-squares quadratic y(x) over one block of points. */
function quadraticResiduals(block: readonly Vec2[]): number[] {
  const mx = block.reduce((s, p) => s + p[0], 0) / block.length
  const m = [[0, 0, 0], [0, 0, 0], [0, 0, 0]]
  const v = [0, 0, 0]
  for (const [x, y] of block) {
    const row = [1, x - mx, (x - mx) ** 2]
    for (let i = 0; i < 3; i++) {
      v[i] += row[i] * y
      for (let j = 0; j < 3; j++) m[i][j] += row[i] * row[j]
    }
  }
  const c = solve(m, v)
  if (!c) return []
  return block.map(([x, y]) => y - (c[0] + c[1] * (x - mx) + c[2] * (x - mx) ** 2))
}

/** Integrated autocorrelation τ = 1 + 2 Σ ρₖ of one block's residuals, summed until ρₖ first drops to 0. */
function blockTau(r: readonly number[], variance: number, maxLag: number): number {
  let tau = 1
  for (let k = 1; k <= maxLag && variance > 0; k++) {
    let sum = 0
    for (let i = 0; i + k < r.length; i++) sum += r[i] * r[i + k]
    const rho = sum / (r.length - k) / variance
    if (!(rho > 0)) break
    tau += 2 * rho
  }
  return tau
}

/**
 * Measures the edge noise on a rocker (blade frame, sorted by x): residuals about quadratics fitted over
 * consecutive blockMm blocks — the rocker is smooth at that scale — and their autocorrelation up to maxLag points,
 * which is how the image engine's smoothing (neighbouring points sharing pixels) shows up. Each block gives a σ
 * and a τ; the medians are reported, so a kink or a glitch in one block does not pass for noise.
 */
export function measureEdgeNoise(rocker: readonly Vec2[], blockMm = 20, maxLag = 40): EdgeNoise {
  const variances: number[] = []
  const taus: number[] = []
  let start = 0
  for (let i = 1; i <= rocker.length; i++)
    if (i === rocker.length || rocker[i][0] - rocker[start][0] >= blockMm) {
      const r = i - start >= 20 ? quadraticResiduals(rocker.slice(start, i)) : []
      if (r.length) {
        const variance = r.reduce((s, v) => s + v * v, 0) / r.length
        variances.push(variance)
        taus.push(blockTau(r, variance, maxLag))
      }
      start = i
    }
  if (!variances.length) return { sigmaMm: 0, tau: 1 }
  return { sigmaMm: Math.sqrt(median(variances)), tau: median(taus) }
}
