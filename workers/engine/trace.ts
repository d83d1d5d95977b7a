import { gaussianPeak, sample } from './image'
import type { Strip } from './rectify'
import type { Silhouette } from './segment'

type Pt = [number, number]

/** The lower side of a closed outline: the path between its leftmost and rightmost points that lies lower (larger v). */
export function lowerPath(outline: Pt[]): Pt[] {
  let left = 0
  let right = 0
  for (let i = 1; i < outline.length; i++) {
    if (outline[i][0] < outline[left][0] || (outline[i][0] === outline[left][0] && outline[i][1] > outline[left][1])) left = i
    if (outline[i][0] > outline[right][0] || (outline[i][0] === outline[right][0] && outline[i][1] > outline[right][1])) right = i
  }
  const walk = (from: number, to: number): Pt[] => {
    const out: Pt[] = []
    for (let i = from; ; i = (i + 1) % outline.length) {
      out.push(outline[i])
      if (i === to) break
    }
    return out
  }
  const a = walk(left, right)
  const b = walk(right, left).reverse()
  const meanV = (p: Pt[]) => p.reduce((s, q) => s + q[1], 0) / p.length
  return meanV(a) >= meanV(b) ? a : b
}

/** Resamples a polyline at equal arc-length steps after a moving-average smoothing of `halfWindow` points. */
export function smoothResample(path: Pt[], halfWindow: number, step: number): Pt[] {
  const smooth: Pt[] = path.map((_, i) => {
    let sx = 0
    let sy = 0
    let n = 0
    for (let k = Math.max(0, i - halfWindow); k <= Math.min(path.length - 1, i + halfWindow); k++) {
      sx += path[k][0]
      sy += path[k][1]
      n++
    }
    return [sx / n, sy / n]
  })
  const out: Pt[] = [smooth[0]]
  let carry = 0
  for (let i = 1; i < smooth.length; i++) {
    const [ax, ay] = smooth[i - 1]
    const seg = Math.hypot(smooth[i][0] - ax, smooth[i][1] - ay)
    let s = step - carry
    while (s <= seg) {
      out.push([ax + ((smooth[i][0] - ax) * s) / seg, ay + ((smooth[i][1] - ay) * s) / seg])
      s += step
    }
    carry = seg - (s - step)
  }
  return out
}

export interface EdgeSample {
  /** Sub-pixel edge position, strip px. */
  p: Pt
  /** Peak gradient (grey levels per strip px) and the edge's blur width (Gaussian sigma, strip px). */
  strength: number
  sigma: number
}

/**
 * Refines each point of a coarse edge along its normal: samples the strip across the edge, differentiates, and fits
 * a parabola to the gradient peak of the steel-to-card step. Points with no clear peak in the window are dropped.
 */
export function refineAlongNormals(strip: Strip, coarse: Pt[], sil: Silhouette, windowPx: number): EdgeSample[] {
  // One-pixel steps: finer steps through a bilinear image only resolve its piecewise-linear facets.
  const step = 1
  const n = Math.round((2 * windowPx) / step) + 1
  const profile = new Float64Array(n)
  const grad = new Float64Array(n - 2)
  const contrast = Math.abs(sil.cardLevel - sil.steelLevel)
  // Walking outward from the steel, brightness rises if the steel is darker.
  const sign: 1 | -1 = sil.darker ? 1 : -1
  const out: EdgeSample[] = []
  for (let i = 0; i < coarse.length; i++) {
    const a = coarse[Math.max(0, i - 2)]
    const b = coarse[Math.min(coarse.length - 1, i + 2)]
    const len = Math.hypot(b[0] - a[0], b[1] - a[1])
    if (len === 0) continue
    // The lower path runs left to right with the steel on its upper side, so (−ty, tx) points out of the steel.
    const nx = -(b[1] - a[1]) / len
    const ny = (b[0] - a[0]) / len
    for (let k = 0; k < n; k++) {
      const s = -windowPx + k * step
      profile[k] = sample(strip.img, coarse[i][0] + nx * s, coarse[i][1] + ny * s)
    }
    for (let k = 1; k < n - 1; k++) grad[k - 1] = (profile[k + 1] - profile[k - 1]) / (2 * step)
    const peak = gaussianPeak(grad, sign)
    if (!peak || !Number.isFinite(peak.value) || sign * peak.value < 0.15 * contrast / windowPx) continue
    const s = -windowPx + (peak.at + 1) * step
    const strength = Math.abs(peak.value)
    out.push({ p: [coarse[i][0] + nx * s, coarse[i][1] + ny * s], strength, sigma: contrast / (strength * Math.sqrt(2 * Math.PI)) })
  }
  return out
}
