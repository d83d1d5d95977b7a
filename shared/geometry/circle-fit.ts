import type { Vec2 } from './vec'
import { centroid } from './vec'
import { symmetricEigen } from './linalg'

/** A circle in the frame of its input points (mm unless named). */
export interface Circle {
  cx: number
  cy: number
  r: number
}

/** Centred second and third moments of the points about their centroid (Chernov 2010, §5). */
interface Moments {
  mean: Vec2
  xx: number
  yy: number
  xy: number
  xz: number
  yz: number
  zz: number
}

function moments(points: readonly Vec2[]): Moments {
  if (points.length < 3) throw new RangeError('circle fit needs at least 3 points')
  const mean = centroid(points)
  let xx = 0, yy = 0, xy = 0, xz = 0, yz = 0, zz = 0
  for (const p of points) {
    const x = p[0] - mean[0]
    const y = p[1] - mean[1]
    const z = x * x + y * y
    xx += x * x; yy += y * y; xy += x * y; xz += x * z; yz += y * z; zz += z * z
  }
  const n = points.length
  return { mean, xx: xx / n, yy: yy / n, xy: xy / n, xz: xz / n, yz: yz / n, zz: zz / n }
}

/**
 * Kåsa's fit (IEEE Trans. Instrum. Meas. IM-25, 1976): least squares on r² − |p − c|², linear in the unknowns.
 * Fast, but biased toward small circles on short arcs; used only as a cross-check.
 */
export function kasaFit(points: readonly Vec2[]): Circle {
  const m = moments(points)
  const det = m.xx * m.yy - m.xy * m.xy
  if (det === 0) throw new RangeError('Kåsa fit: points are collinear')
  const a = (m.xz * m.yy - m.yz * m.xy) / (2 * det)
  const b = (m.yz * m.xx - m.xz * m.xy) / (2 * det)
  return { cx: a + m.mean[0], cy: b + m.mean[1], r: Math.sqrt(a * a + b * b + m.xx + m.yy) }
}

/**
 * Algebraic circle A(x²+y²) + Bx + Cy + D = 0 in centred coordinates, scaled so B² + C² − 4AD = 1.
 * In this form a straight line is the limit A → 0 instead of an infinite radius, and |2A| is the curvature.
 */
export interface AlgebraicCircle {
  mean: Vec2
  a: number
  b: number
  c: number
  d: number
}

/**
 * Newton iteration from 0 for the smallest non-negative root of the polynomial Σ coeffs[k]·x^k, as in Chernov's
 * reference implementations of the Pratt and Taubin fits (Chernov, Circular and Linear Regression, 2010).
 */
function smallestRoot(coeffs: readonly number[]): number {
  const value = (x: number) => coeffs.reduceRight((acc, c) => acc * x + c, 0)
  const slope = (x: number) => coeffs.reduceRight((acc, c, k) => (k === 0 ? acc : acc * x + k * c), 0)
  let x = 0
  let y = value(0)
  for (let i = 0; i < 99; i++) {
    const xNew = x - y / slope(x)
    if (xNew === x || !Number.isFinite(xNew)) break
    const yNew = value(xNew)
    if (Math.abs(yNew) >= Math.abs(y)) break
    x = xNew
    y = yNew
  }
  return x
}

/** Builds the normalised algebraic circle from the eigen-parameter x of the Pratt/Taubin problem. */
function algebraic(m: Moments, x: number, dTerm: number): AlgebraicCircle {
  const det = x * x - x * (m.xx + m.yy) + (m.xx * m.yy - m.xy * m.xy)
  const p = m.xz * (m.yy - x) - m.yz * m.xy
  const q = m.yz * (m.xx - x) - m.xz * m.xy
  // Circle (X − p/2det)² + (Y − q/2det)² = ... multiplied through by det so a line (det → 0) stays finite.
  const u = [det, -p, -q, -det * dTerm]
  const s = Math.sqrt(u[1] * u[1] + u[2] * u[2] - 4 * u[0] * u[3])
  return { mean: m.mean, a: u[0] / s, b: u[1] / s, c: u[2] / s, d: u[3] / s }
}

/** Pratt's fit (Computer Graphics 21(4), 1987) in algebraic form; nearly unbiased, handles lines. */
export function prattAlgebraic(points: readonly Vec2[]): AlgebraicCircle {
  const m = moments(points)
  const mz = m.xx + m.yy
  const cov = m.xx * m.yy - m.xy * m.xy
  const a2 = 4 * cov - 3 * mz * mz - m.zz
  const a1 = m.zz * mz + 4 * cov * mz - m.xz * m.xz - m.yz * m.yz - mz * mz * mz
  const a0 = m.xz * m.xz * m.yy + m.yz * m.yz * m.xx - m.zz * cov - 2 * m.xz * m.yz * m.xy + mz * mz * cov
  // Pratt's characteristic polynomial is a quartic with leading coefficient 4 and no cubic term.
  const x = smallestRoot([a0, a1, a2, 0, 4])
  return algebraic(m, x, mz + 2 * x)
}

/** Taubin's fit (IEEE PAMI 13(11), 1991) in algebraic form. */
export function taubinAlgebraic(points: readonly Vec2[]): AlgebraicCircle {
  const m = moments(points)
  const mz = m.xx + m.yy
  const cov = m.xx * m.yy - m.xy * m.xy
  const varZ = m.zz - mz * mz
  const a3 = 4 * mz
  const a2 = -3 * mz * mz - m.zz
  const a1 = varZ * mz + 4 * cov * mz - m.xz * m.xz - m.yz * m.yz
  const a0 = m.xz * (m.xz * m.yy - m.yz * m.xy) + m.yz * (m.yz * m.xx - m.xz * m.xy) - varZ * cov
  const x = smallestRoot([a0, a1, a2, a3])
  return algebraic(m, x, mz)
}

/** Centre and radius of an algebraic circle; radius Infinity (centre NaN) for a straight line. */
export function toCircle(u: AlgebraicCircle): Circle {
  if (u.a === 0) return { cx: NaN, cy: NaN, r: Infinity }
  return { cx: u.mean[0] - u.b / (2 * u.a), cy: u.mean[1] - u.c / (2 * u.a), r: 1 / (2 * Math.abs(u.a)) }
}

export const prattFit = (points: readonly Vec2[]): Circle => toCircle(prattAlgebraic(points))
export const taubinFit = (points: readonly Vec2[]): Circle => toCircle(taubinAlgebraic(points))

/**
 * Signed orthogonal distance of p from an algebraic circle, stable for lines (Chernov & Ososkov form):
 * d = 2P / (1 + √(1 + 4AP)), P = A(x²+y²) + Bx + Cy + D in the circle's centred coordinates.
 */
export function algebraicDistance(u: AlgebraicCircle, p: Vec2): number {
  const x = p[0] - u.mean[0]
  const y = p[1] - u.mean[1]
  const P = u.a * (x * x + y * y) + u.b * x + u.c * y + u.d
  const disc = 1 + 4 * u.a * P
  return (2 * P) / (1 + Math.sqrt(Math.max(disc, 0)))
}

/** Root-mean-square orthogonal distance of the points from a circle. */
export function circleRms(circle: Circle, points: readonly Vec2[]): number {
  let s = 0
  for (const p of points) s += (Math.hypot(p[0] - circle.cx, p[1] - circle.cy) - circle.r) ** 2
  return Math.sqrt(s / points.length)
}

/**
 * The plain algebraic fit with ‖(A, B, C, D)‖ = 1 (Gander, Golub & Strebel 1994, §3), taken as the eigenvector of
 * the smallest eigenvalue of ZᵀZ on raw coordinates. Kept as the paper's baseline; it is not similarity-invariant.
 */
export function unitNormAlgebraicFit(points: readonly Vec2[]): Circle {
  if (points.length < 3) throw new RangeError('circle fit needs at least 3 points')
  const rows = points.map((p) => [p[0] * p[0] + p[1] * p[1], p[0], p[1], 1])
  const ztz = [0, 1, 2, 3].map((i) => [0, 1, 2, 3].map((j) => rows.reduce((s, r) => s + r[i] * r[j], 0)))
  const [a, b, c, d] = symmetricEigen(ztz).vectors[0]
  const cx = -b / (2 * a)
  const cy = -c / (2 * a)
  return { cx, cy, r: Math.sqrt(cx * cx + cy * cy - d / a) }
}
