import type { AlgebraicCircle, Circle } from './circle-fit'
import { algebraicDistance, prattAlgebraic, toCircle } from './circle-fit'
import type { Vec2 } from './vec'
import { median } from './vec'
import { solve } from './linalg'

/** Result of the geometric (orthogonal-distance) circle fit; lengths in the input frame's units (mm). */
export interface GeometricFit {
  circle: Circle
  /** The same circle in algebraic form, finite for a straight line (see AlgebraicCircle). */
  algebraic: AlgebraicCircle
  /** Unsigned curvature 1/r, exactly 0 for a line (1/mm). */
  curvature: number
  /** Root-mean-square orthogonal residual. */
  rms: number
  iterations: number
}

/** Parameters (A, D, θ) of the line-safe circle parametrisation, in coordinates centred and scaled for conditioning. */
type Params = [number, number, number]

function residuals(p: Params, q: readonly Vec2[], out: Float64Array): boolean {
  const [a, d, theta] = p
  const e = 1 + 4 * a * d
  if (!(e > 0)) return false
  const b = Math.sqrt(e) * Math.cos(theta)
  const c = Math.sqrt(e) * Math.sin(theta)
  for (let i = 0; i < q.length; i++) {
    const [x, y] = q[i]
    const P = a * (x * x + y * y) + b * x + c * y + d
    const disc = 1 + 4 * a * P
    if (disc < 0) return false
    out[i] = (2 * P) / (1 + Math.sqrt(disc))
  }
  return true
}

function sumSq(r: Float64Array): number {
  let s = 0
  for (let i = 0; i < r.length; i++) s += r[i] * r[i]
  return s
}

/**
 * Analytic Jacobian of d = 2P / (1 + √(1 + 4AP)) with respect to (A, D, θ), where P = A(x²+y²) + Bx + Cy + D,
 * B = e·cos θ, C = e·sin θ, e = √(1 + 4AD). Null when the parameters leave the valid region.
 */
function jacobian(p: Params, q: readonly Vec2[]): Float64Array[] | null {
  const [a, d, theta] = p
  const e = Math.sqrt(1 + 4 * a * d)
  if (!(e > 0)) return null
  const [cos, sin] = [Math.cos(theta), Math.sin(theta)]
  const cols = [new Float64Array(q.length), new Float64Array(q.length), new Float64Array(q.length)]
  for (let i = 0; i < q.length; i++) {
    const [x, y] = q[i]
    const u = x * cos + y * sin
    const P = a * (x * x + y * y) + e * u + d
    const Q = Math.sqrt(1 + 4 * a * P)
    if (!(Q > 0)) return null
    const den = (1 + Q) * (1 + Q)
    const dP = (2 * (1 + Q) - (4 * a * P) / Q) / den
    const dADirect = (-4 * P * P) / (Q * den)
    cols[0][i] = dP * (x * x + y * y + ((2 * d) / e) * u) + dADirect
    cols[1][i] = dP * (1 + ((2 * a) / e) * u)
    cols[2][i] = dP * e * (-x * sin + y * cos)
  }
  return cols
}

/** One damped normal-equation step (JᵀJ + λ·diag(JᵀJ)) δ = −Jᵀr. */
function lmStep(jac: Float64Array[], r: Float64Array, lambda: number): number[] | null {
  const h = [[0, 0, 0], [0, 0, 0], [0, 0, 0]]
  const g = [0, 0, 0]
  for (let n = 0; n < r.length; n++) {
    const j0 = jac[0][n]
    const j1 = jac[1][n]
    const j2 = jac[2][n]
    h[0][0] += j0 * j0; h[0][1] += j0 * j1; h[0][2] += j0 * j2
    h[1][1] += j1 * j1; h[1][2] += j1 * j2; h[2][2] += j2 * j2
    g[0] += j0 * r[n]; g[1] += j1 * r[n]; g[2] += j2 * r[n]
  }
  h[1][0] = h[0][1]; h[2][0] = h[0][2]; h[2][1] = h[1][2]
  for (let i = 0; i < 3; i++) h[i][i] += lambda * h[i][i] + 1e-18
  return solve(h, g.map((v) => -v))
}

/**
 * Geometric circle fit: minimises the sum of squared orthogonal distances by Levenberg–Marquardt of our own, in
 * the (A, D, θ) parametrisation (Chernov 2010, §4.8) so nearly straight arcs — a 2 m rocker over 40 mm — converge
 * instead of running the centre off to infinity. Starts from Pratt's fit unless a start is given.
 * Frame and units are those of the points (mm); needs at least 3 points.
 */
export function geometricFit(points: readonly Vec2[], start?: AlgebraicCircle): GeometricFit {
  const init = start ?? prattAlgebraic(points)
  const [mx, my] = init.mean
  const s = Math.sqrt(points.reduce((acc, p) => acc + (p[0] - mx) ** 2 + (p[1] - my) ** 2, 0) / points.length) || 1
  const q = points.map((p): Vec2 => [(p[0] - mx) / s, (p[1] - my) / s])
  let p: Params = [init.a * s, init.d / s, Math.atan2(init.c, init.b)]
  const r = new Float64Array(q.length)
  const trial = new Float64Array(q.length)
  if (!residuals(p, q, r)) throw new RangeError('geometric fit: invalid starting circle')
  let cost = sumSq(r)
  let lambda = 1e-3
  let iterations = 0
  for (; iterations < 200; iterations++) {
    const jac = jacobian(p, q)
    const delta = jac && lmStep(jac, r, lambda)
    if (!delta) break
    const next: Params = [p[0] + delta[0], p[1] + delta[1], p[2] + delta[2]]
    const ok = residuals(next, q, trial)
    const nextCost = ok ? sumSq(trial) : Infinity
    if (nextCost < cost) {
      const gain = cost - nextCost
      p = next
      r.set(trial)
      cost = nextCost
      lambda = Math.max(lambda * 0.3, 1e-12)
      if (gain <= 1e-14 * cost || Math.hypot(...delta) < 1e-13) break
    } else {
      // At the minimum every step fails; stop once the rejected step is negligible instead of raising λ for ever.
      if (Math.hypot(...delta) < 1e-10 * (1 + Math.hypot(...p)) || lambda > 1e8) break
      lambda *= 10
    }
  }
  return finish(p, s, init.mean, cost, points.length, iterations)
}

function finish(p: Params, s: number, mean: Vec2, cost: number, n: number, iterations: number): GeometricFit {
  const [a, d, theta] = p
  const e = Math.sqrt(1 + 4 * a * d)
  const algebraic: AlgebraicCircle = { mean, a: a / s, b: e * Math.cos(theta), c: e * Math.sin(theta), d: d * s }
  return {
    circle: toCircle(algebraic),
    algebraic,
    curvature: 2 * Math.abs(algebraic.a),
    rms: Math.sqrt(cost / n) * s,
    iterations,
  }
}

/**
 * Signed curvature (1/mm) of a fitted arc in a y-up frame: positive when the centre lies above the points (an arc
 * that bulges downward, as a rocker does toward the ice), negative when it bulges upward.
 */
export function signedCurvature(u: AlgebraicCircle): number {
  // Centre y − mean y = −C / 2A, so the sign of the curvature is that of −A·C.
  return u.c === 0 ? 2 * Math.abs(u.a) : -2 * u.a * Math.sign(u.c)
}

/**
 * Geometric fit that sets aside gross outliers — specks, reflections, a few mis-traced points — before the final
 * fit: points farther than `cutoff` robust σ (1.4826 × median |residual|) from the circle are dropped and the rest
 * refitted, up to `rounds` times. The floor keeps a noise-free edge from losing points to rounding. Returns the
 * fit and how many points it kept.
 */
export function trimmedGeometricFit(points: readonly Vec2[], cutoff = 4, rounds = 2, floorMm = 1e-4): GeometricFit & { kept: number } {
  let pts = points
  let fit = geometricFit(pts)
  for (let round = 0; round < rounds; round++) {
    const res = pts.map((p) => Math.abs(algebraicDistance(fit.algebraic, p)))
    const sigma = 1.4826 * median(res)
    const keep = pts.filter((_, i) => res[i] <= Math.max(cutoff * sigma, floorMm))
    if (keep.length === pts.length || keep.length < Math.max(10, pts.length / 2)) break
    pts = keep
    fit = geometricFit(pts, fit.algebraic)
  }
  return { ...fit, kept: pts.length }
}
