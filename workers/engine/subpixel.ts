import { gaussianPeak, sample, type GreyImage } from './image'
import type { DetectedMarker } from './markers'

type Pt = [number, number]

/** A line in normal form: n·p = c, |n| = 1. */
export interface Line {
  nx: number
  ny: number
  c: number
}

/** Total-least-squares line through points, with one pass of outlier rejection (> 3 robust sigmas). */
export function fitLine(points: Pt[]): Line | null {
  const fit = (pts: Pt[]): Line | null => {
    if (pts.length < 3) return null
    let mx = 0
    let my = 0
    for (const [x, y] of pts) {
      mx += x
      my += y
    }
    mx /= pts.length
    my /= pts.length
    let sxx = 0
    let sxy = 0
    let syy = 0
    for (const [x, y] of pts) {
      sxx += (x - mx) ** 2
      sxy += (x - mx) * (y - my)
      syy += (y - my) ** 2
    }
    // The normal is the eigenvector of the scatter matrix with the smaller eigenvalue.
    const theta = 0.5 * Math.atan2(2 * sxy, sxx - syy)
    const nx = -Math.sin(theta)
    const ny = Math.cos(theta)
    return { nx, ny, c: nx * mx + ny * my }
  }
  const first = fit(points)
  if (!first) return null
  const res = points.map(([x, y]) => Math.abs(first.nx * x + first.ny * y - first.c))
  const sorted = [...res].sort((a, b) => a - b)
  const sigma = Math.max(0.05, 1.4826 * sorted[Math.floor(sorted.length / 2)])
  const kept = points.filter((_, i) => res[i] <= 3 * sigma)
  return fit(kept) ?? first
}

export function intersect(a: Line, b: Line): Pt | null {
  const det = a.nx * b.ny - a.ny * b.nx
  if (Math.abs(det) < 1e-9) return null
  return [(a.c * b.ny - a.ny * b.c) / det, (a.nx * b.c - a.c * b.nx) / det]
}

/** Sub-pixel positions of the dark-to-light step along the outward normal of one marker side. */
function sideEdgePoints(img: GreyImage, a: Pt, b: Pt, centre: Pt, window: number): Pt[] {
  const len = Math.hypot(b[0] - a[0], b[1] - a[1])
  const tx = (b[0] - a[0]) / len
  const ty = (b[1] - a[1]) / len
  let nx = -ty
  let ny = tx
  const mid: Pt = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]
  if (nx * (mid[0] - centre[0]) + ny * (mid[1] - centre[1]) < 0) {
    nx = -nx
    ny = -ny
  }
  const count = Math.max(6, Math.min(40, Math.floor(len / 3)))
  const step = 1
  const n = Math.round((2 * window) / step) + 1
  const out: Pt[] = []
  const profile = new Float64Array(n)
  const grad = new Float64Array(n - 2)
  for (let k = 0; k < count; k++) {
    // Stay away from the corners, where the two sides' steps mix.
    const t = 0.15 + (0.7 * k) / (count - 1)
    const px = a[0] + (b[0] - a[0]) * t
    const py = a[1] + (b[1] - a[1]) * t
    for (let i = 0; i < n; i++) {
      const s = -window + i * step
      profile[i] = sample(img, px + nx * s, py + ny * s)
    }
    for (let i = 1; i < n - 1; i++) grad[i - 1] = profile[i + 1] - profile[i - 1]
    const peak = gaussianPeak(grad, 1)
    if (!peak || !(peak.value > 8)) continue
    const s = -window + (peak.at + 1) * step
    out.push([px + nx * s, py + ny * s])
  }
  return out
}

/**
 * Refines a marker's corners at full resolution: fits a line to the outer border's step on each side and
 * intersects neighbouring lines (OpenCV.js has no cornerSubPix). Returns null if a side cannot be fitted.
 */
export function refineMarkerCorners(img: GreyImage, marker: DetectedMarker, window: number): Pt[] | null {
  const c = marker.corners
  const centre: Pt = [(c[0][0] + c[1][0] + c[2][0] + c[3][0]) / 4, (c[0][1] + c[1][1] + c[2][1] + c[3][1]) / 4]
  const lines: Line[] = []
  for (let i = 0; i < 4; i++) {
    const pts = sideEdgePoints(img, c[i], c[(i + 1) % 4], centre, window)
    if (pts.length < 5) return null
    const line = fitLine(pts)
    if (!line) return null
    lines.push(line)
  }
  const refined: Pt[] = []
  for (let i = 0; i < 4; i++) {
    // Corner i joins side i-1 (from corner i-1 to i) and side i (from corner i to i+1).
    const p = intersect(lines[(i + 3) % 4], lines[i])
    if (!p || Math.hypot(p[0] - c[i][0], p[1] - c[i][1]) > 2 * window) return null
    refined.push(p)
  }
  return refined
}
