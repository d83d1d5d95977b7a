/** A 2-D point or vector, [x, y]; units and frame are those of the caller (mm unless named). */
export type Vec2 = [number, number]

export const add = (a: Vec2, b: Vec2): Vec2 => [a[0] + b[0], a[1] + b[1]]
export const sub = (a: Vec2, b: Vec2): Vec2 => [a[0] - b[0], a[1] - b[1]]
export const scale = (a: Vec2, s: number): Vec2 => [a[0] * s, a[1] * s]
export const dot = (a: Vec2, b: Vec2): number => a[0] * b[0] + a[1] * b[1]
/** z component of the 3-D cross product: positive when b lies counter-clockwise of a (y up). */
export const cross = (a: Vec2, b: Vec2): number => a[0] * b[1] - a[1] * b[0]
export const norm = (a: Vec2): number => Math.hypot(a[0], a[1])
export const dist = (a: Vec2, b: Vec2): number => Math.hypot(a[0] - b[0], a[1] - b[1])
export const lerp = (a: Vec2, b: Vec2, t: number): Vec2 => [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t]

/** Unit vector along a; throws on a zero vector because a direction is then undefined. */
export function unit(a: Vec2): Vec2 {
  const n = norm(a)
  if (n === 0) throw new RangeError('unit(): zero vector has no direction')
  return [a[0] / n, a[1] / n]
}

/** Rotates a counter-clockwise by angle (radians) in a y-up frame. */
export function rotate(a: Vec2, angle: number): Vec2 {
  const c = Math.cos(angle)
  const s = Math.sin(angle)
  return [c * a[0] - s * a[1], s * a[0] + c * a[1]]
}

/** Centroid of a non-empty point set. */
export function centroid(points: readonly Vec2[]): Vec2 {
  let sx = 0
  let sy = 0
  for (const p of points) {
    sx += p[0]
    sy += p[1]
  }
  return [sx / points.length, sy / points.length]
}

export const degToRad = (deg: number): number => (deg * Math.PI) / 180
export const radToDeg = (rad: number): number => (rad * 180) / Math.PI

/** Median of a non-empty list (the list is not modified). */
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b)
  const m = s.length >> 1
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2
}

/**
 * Linear interpolation of y at x on a polyline whose x increases; null outside its x range.
 * Used to read heights of a profile at a station.
 */
export function interpolateY(points: readonly Vec2[], x: number): number | null {
  if (points.length < 2 || x < points[0][0] || x > points[points.length - 1][0]) return null
  let lo = 0
  let hi = points.length - 1
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1
    if (points[mid][0] <= x) lo = mid
    else hi = mid
  }
  const [x0, y0] = points[lo]
  const [x1, y1] = points[hi]
  return x1 === x0 ? y0 : y0 + ((y1 - y0) * (x - x0)) / (x1 - x0)
}

/**
 * Least-squares line y = slope·x + intercept through the points, with the slope's standard error per unit of point
 * noise (1/√Σ(x − x̄)²); null when the x values do not spread.
 */
export function fitLineYOnX(points: readonly Vec2[]): { slope: number; intercept: number; unitSigma: number } | null {
  const [mx, my] = centroid(points)
  let sxx = 0
  let sxy = 0
  for (const p of points) {
    sxx += (p[0] - mx) ** 2
    sxy += (p[0] - mx) * (p[1] - my)
  }
  if (!(sxx > 0)) return null
  return { slope: sxy / sxx, intercept: my - (sxy / sxx) * mx, unitSigma: 1 / Math.sqrt(sxx) }
}
