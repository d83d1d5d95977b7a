import { solve } from '../../shared/geometry/linalg'

/**
 * Sub-pixel edge location by fitting a model of the blurred scene across the edge, for where a gradient peak is
 * biased: just above the card's bottom edge, the card-to-table step follows the steel's edge within the blur, and
 * the two steps' blurred profiles overlap. Across the edge the scene is steel up to the edge e, then card up to the
 * card's bottom edge b (known from the calibration), then table — or, once e lies past b, steel then table. Blurred
 * by a Gaussian of sigma σ, the profile is S + (C − S)·Φ((s − e)/σ) + (T − C)·Φ((s − b)/σ): linear in the levels
 * S, C, T for a given e, so each candidate e costs one small least-squares solve and the best e is found by a scan.
 */

/** Standard normal CDF, from erf by Abramowitz & Stegun 7.1.26 (absolute error under 1.5e-7). */
export function normalCdf(x: number): number {
  const z = Math.abs(x) / Math.SQRT2
  const t = 1 / (1 + 0.3275911 * z)
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))))
  const erf = 1 - poly * Math.exp(-z * z)
  return x >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf)
}

/** Least-squares residual of profile[k] (at positions from + k, k in [k0, k1]) on the given basis columns. */
function residual(profile: ArrayLike<number>, from: number, k0: number, k1: number, basis: ((s: number) => number)[]): number {
  const m = basis.length
  const ata = new Float64Array(m * m)
  const atb = new Float64Array(m)
  let btb = 0
  const row = new Float64Array(m)
  for (let k = k0; k <= k1; k++) {
    const s = from + k
    for (let a = 0; a < m; a++) row[a] = basis[a](s)
    const y = profile[k]
    for (let a = 0; a < m; a++) {
      atb[a] += row[a] * y
      for (let c = 0; c < m; c++) ata[a * m + c] += row[a] * row[c]
    }
    btb += y * y
  }
  const x = solve(Array.from({ length: m }, (_, a) => Array.from(ata.subarray(a * m, a * m + m))), Array.from(atb))
  if (!x) return Infinity
  let fit = 0
  for (let a = 0; a < m; a++) fit += x[a] * atb[a]
  return btb - fit
}

export interface StepFitRequest {
  /** Brightness across the edge at positions from, from + 1, … (px along the normal, outward from the steel). */
  profile: ArrayLike<number>
  from: number
  /** Where the card's bottom edge lies along the normal (px), or null when it is not near. */
  boundary: number | null
  /** Blur of the photo at the edge (Gaussian sigma, px). */
  sigma: number
  /** First estimate of the edge (px) and how far from it the edge is searched (px). */
  guess: number
  reach: number
}

/** The edge position (px along the normal) that best explains the profile under the model above; null if none. */
export function fitEdgeWithBoundary(r: StepFitRequest): number | null {
  const { profile, from, boundary, sigma, guess, reach } = r
  const span = Math.max(4 * sigma, 4)
  const far = boundary !== null ? Math.max(guess + reach, boundary) : guess + reach
  const k0 = Math.max(0, Math.floor(guess - reach - span - from))
  const k1 = Math.min(profile.length - 1, Math.ceil(far + span - from))
  if (k1 - k0 < 6) return null
  const step = 0.1
  const costs: number[] = []
  const positions: number[] = []
  for (let e = guess - reach; e <= guess + reach + 1e-9; e += step) {
    const basis: ((s: number) => number)[] = [() => 1, (s) => normalCdf((s - e) / sigma)]
    // While the steel's edge lies in front of the card's bottom edge, a strip of card shows between them.
    if (boundary !== null && e < boundary) basis.push((s) => normalCdf((s - boundary) / sigma))
    positions.push(e)
    costs.push(residual(profile, from, k0, k1, basis))
  }
  let best = 0
  for (let i = 1; i < costs.length; i++) if (costs[i] < costs[best]) best = i
  if (!Number.isFinite(costs[best])) return null
  if (best === 0 || best === costs.length - 1) return positions[best]
  // Parabola through the best cost and its neighbours.
  const [a, b, c] = [costs[best - 1], costs[best], costs[best + 1]]
  const denom = a - 2 * b + c
  return positions[best] + (denom > 0 ? (0.5 * step * (a - c)) / denom : 0)
}
