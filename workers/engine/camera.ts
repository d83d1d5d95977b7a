import { apply, invert, multiply, type Mat3, type Pt } from './projective'

/**
 * One-parameter division model of radial lens distortion about the image centre: an undistorted point is
 * c + (p − c) / (1 + k·r²), with r the distance from c in units of the half-diagonal (so k stays near ±0.1).
 */
export interface Distortion {
  k: number
  cx: number
  cy: number
  /** Half-diagonal of the photo, px. */
  norm: number
}

export function noDistortion(width: number, height: number): Distortion {
  return { k: 0, cx: (width - 1) / 2, cy: (height - 1) / 2, norm: Math.hypot(width, height) / 2 }
}

/** Distorted photo px → undistorted px. */
export function undistort(d: Distortion, p: Pt): Pt {
  const dx = p[0] - d.cx
  const dy = p[1] - d.cy
  const s = 1 + d.k * ((dx * dx + dy * dy) / (d.norm * d.norm))
  return [d.cx + dx / s, d.cy + dy / s]
}

/** Undistorted px → distorted photo px (closed-form inverse of the division model). */
export function distort(d: Distortion, p: Pt): Pt {
  const dx = p[0] - d.cx
  const dy = p[1] - d.cy
  const ru = Math.hypot(dx, dy) / d.norm
  if (d.k === 0 || ru < 1e-12) return [p[0], p[1]]
  const disc = 1 - 4 * d.k * ru * ru
  if (disc < 0) return [NaN, NaN]
  const rd = (1 - Math.sqrt(disc)) / (2 * d.k * ru)
  return [d.cx + (dx * rd) / ru, d.cy + (dy * rd) / ru]
}

/** The camera pose of a plane, from its homography plane mm → undistorted px. */
export interface PlanePose {
  /** Focal length, px. */
  focalPx: number
  /** Whether the focal length came from the homography (true) or a default because the view was too square-on. */
  focalFromPhoto: boolean
  /** Distance from the camera to the plane's origin, mm. */
  distanceMm: number
  /** Plane x and y axes and normal (x × y) in camera coordinates, and the origin's position, mm. */
  r1: number[]
  r2: number[]
  r3: number[]
  t: number[]
}

/**
 * Focal length from a plane homography under a centred principal point and square pixels: the images of the plane's
 * axes must be orthogonal and of equal length (Zhang's constraints), solved together by least squares in 1/f².
 */
function focalFromHomography(hc: Mat3, fallback: number): { f: number; measured: boolean } {
  const [a, b, , d, e, , g, h] = hc
  const rows = [
    [a * b + d * e, g * h],
    [a * a + d * d - b * b - e * e, g * g - h * h],
  ]
  let num = 0
  let den = 0
  for (const [p, q] of rows) {
    num -= p * q
    den += p * p
  }
  const w = den > 0 ? num / den : 0
  const f = w > 0 ? 1 / Math.sqrt(w) : NaN
  // A nearly square-on view leaves f unconstrained; fall back to a typical phone lens then.
  if (!Number.isFinite(f) || f < 0.4 * fallback || f > 3 * fallback) return { f: fallback, measured: false }
  return { f, measured: true }
}

export function planePose(h: Mat3, d: Distortion, width: number, height: number): PlanePose {
  const shift: Mat3 = [1, 0, -d.cx, 0, 1, -d.cy, 0, 0, 1]
  const hc = multiply(shift, h)
  // A phone main camera's field of view is about 70° across the diagonal: f ≈ 0.72 × the diagonal (from memory).
  const { f, measured } = focalFromHomography(hc, 0.72 * Math.hypot(width, height))
  const m = [hc[0] / f, hc[1] / f, hc[2] / f, hc[3] / f, hc[4] / f, hc[5] / f, hc[6], hc[7], hc[8]]
  const n1 = Math.hypot(m[0], m[3], m[6])
  const n2 = Math.hypot(m[1], m[4], m[7])
  let s = 2 / (n1 + n2)
  if (m[8] * s < 0) s = -s
  const r1 = [m[0] * s, m[3] * s, m[6] * s]
  const r2 = [m[1] * s, m[4] * s, m[7] * s]
  const t = [m[2] * s, m[5] * s, m[8] * s]
  const r3 = [r1[1] * r2[2] - r1[2] * r2[1], r1[2] * r2[0] - r1[0] * r2[2], r1[0] * r2[1] - r1[1] * r2[0]]
  return { focalPx: f, focalFromPhoto: measured, distanceMm: Math.hypot(t[0], t[1], t[2]), r1, r2, r3, t }
}

/**
 * Homography from the plane parallel to the card at signed depth z (card normal, mm; negative = toward the camera)
 * to undistorted photo px. Points of that plane are given by their card-frame x and y.
 */
export function offsetPlaneHomography(pose: PlanePose, d: Distortion, z: number): Mat3 {
  const { r1, r2, r3, t, focalPx: f } = pose
  const t2 = [t[0] + z * r3[0], t[1] + z * r3[1], t[2] + z * r3[2]]
  const k: Mat3 = [f, 0, d.cx, 0, f, d.cy, 0, 0, 1]
  return multiply(k, [r1[0], r2[0], t2[0], r1[1], r2[1], t2[1], r1[2], r2[2], t2[2]])
}

/** Maps a distorted photo px onto card-frame mm of the plane the homography describes. */
export function photoToPlane(hPlane: Mat3, d: Distortion, p: Pt): Pt {
  return apply(invert(hPlane), undistort(d, p))
}
