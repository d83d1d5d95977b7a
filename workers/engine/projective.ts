/** 3×3 matrices as row-major arrays of 9 numbers, and the small projective helpers the engine needs. */
export type Mat3 = number[]
export type Pt = [number, number]

export function apply(h: Mat3, p: Pt): Pt {
  const w = h[6] * p[0] + h[7] * p[1] + h[8]
  return [(h[0] * p[0] + h[1] * p[1] + h[2]) / w, (h[3] * p[0] + h[4] * p[1] + h[5]) / w]
}

/** The flat 3 × 3 matrix as rows (the shared geometry's and the stored result's form). */
export function toRows(h: Mat3): number[][] {
  return [h.slice(0, 3), h.slice(3, 6), h.slice(6, 9)]
}

export function multiply(a: Mat3, b: Mat3): Mat3 {
  const out = new Array<number>(9)
  for (let r = 0; r < 3; r++)
    for (let c = 0; c < 3; c++) out[3 * r + c] = a[3 * r] * b[c] + a[3 * r + 1] * b[3 + c] + a[3 * r + 2] * b[6 + c]
  return out
}

export function invert(m: Mat3): Mat3 {
  const [a, b, c, d, e, f, g, h, i] = m
  const A = e * i - f * h
  const B = -(d * i - f * g)
  const C = d * h - e * g
  const det = a * A + b * B + c * C
  if (Math.abs(det) < 1e-300) throw new Error('singular matrix')
  return [
    A / det, -(b * i - c * h) / det, (b * f - c * e) / det,
    B / det, (a * i - c * g) / det, -(a * f - c * d) / det,
    C / det, -(a * h - b * g) / det, (a * e - b * d) / det,
  ]
}

/** Scales a homography so its last element is 1 (when it can be). */
export function normalise(h: Mat3): Mat3 {
  const s = Math.abs(h[8]) > 1e-12 ? h[8] : 1
  return h.map((v) => v / s)
}

/** Root-mean-square distance between H(src) and dst, in dst units. */
export function rmsResidual(h: Mat3, src: Pt[], dst: Pt[]): number {
  let sum = 0
  for (let i = 0; i < src.length; i++) {
    const p = apply(h, src[i])
    sum += (p[0] - dst[i][0]) ** 2 + (p[1] - dst[i][1]) ** 2
  }
  return Math.sqrt(sum / Math.max(1, src.length))
}
