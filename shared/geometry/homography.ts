import type { Vec2 } from './vec'
import type { Matrix } from './linalg'
import { inverse, matMul, symmetricEigen } from './linalg'

/** 3×3 row-major projective transform, e.g. card-frame mm → photo px. */
export type Homography = Matrix

/** Maps a point through h; returns [NaN, NaN] for a point sent to infinity. */
export function applyHomography(h: Homography, p: Vec2): Vec2 {
  const w = h[2][0] * p[0] + h[2][1] * p[1] + h[2][2]
  if (w === 0) return [NaN, NaN]
  return [(h[0][0] * p[0] + h[0][1] * p[1] + h[0][2]) / w, (h[1][0] * p[0] + h[1][1] * p[1] + h[1][2]) / w]
}

/** Local scale of h at p: the geometric mean of how much it stretches a unit step in x and in y (e.g. photo px per mm). */
export function localScale(h: Homography, p: Vec2): number {
  const a = applyHomography(h, p)
  const b = applyHomography(h, [p[0] + 1, p[1]])
  const c = applyHomography(h, [p[0], p[1] + 1])
  return Math.sqrt(Math.abs((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])))
}

/** Scales h so h[2][2] = 1 (or its largest entry to 1 when h[2][2] is 0), the usual unique representative. */
export function normaliseHomography(h: Homography): Homography {
  const s = h[2][2] !== 0 ? h[2][2] : Math.max(...h.flat().map(Math.abs))
  return h.map((row) => row.map((v) => v / s))
}

/** Inverse transform (photo px → card mm for a card → photo homography). Throws when h is singular. */
export function invertHomography(h: Homography): Homography {
  const inv = inverse(h)
  if (!inv) throw new RangeError('homography is singular')
  return normaliseHomography(inv)
}

/** Similarity that moves the centroid to 0 and the mean distance to √2 (Hartley & Zisserman, alg. 4.2). */
function normaliser(points: readonly Vec2[]): Homography {
  const n = points.length
  const mx = points.reduce((s, p) => s + p[0], 0) / n
  const my = points.reduce((s, p) => s + p[1], 0) / n
  const meanDist = points.reduce((s, p) => s + Math.hypot(p[0] - mx, p[1] - my), 0) / n
  const s = meanDist > 0 ? Math.SQRT2 / meanDist : 1
  return [[s, 0, -s * mx], [0, s, -s * my], [0, 0, 1]]
}

/**
 * Normalised direct linear transform (Hartley & Zisserman, Multiple View Geometry, 2nd ed., algorithm 4.2):
 * the h minimising ‖A h‖ with ‖h‖ = 1 on normalised points, then denormalised. Needs ≥ 4 correspondences,
 * no three of the first four collinear. Units of src and dst are the caller's (e.g. mm → px).
 */
export function fitHomography(src: readonly Vec2[], dst: readonly Vec2[]): Homography {
  if (src.length !== dst.length || src.length < 4) throw new RangeError('homography needs ≥ 4 point pairs')
  const ts = normaliser(src)
  const td = normaliser(dst)
  const ata: Matrix = Array.from({ length: 9 }, () => new Array<number>(9).fill(0))
  for (let i = 0; i < src.length; i++) {
    const [x, y] = applyHomography(ts, src[i])
    const [u, v] = applyHomography(td, dst[i])
    accumulate(ata, [0, 0, 0, -x, -y, -1, v * x, v * y, v])
    accumulate(ata, [x, y, 1, 0, 0, 0, -u * x, -u * y, -u])
  }
  // The smallest right singular vector of A is the smallest eigenvector of AᵀA; normalisation keeps this well posed.
  const hv = symmetricEigen(ata).vectors[0]
  const hn: Homography = [hv.slice(0, 3), hv.slice(3, 6), hv.slice(6, 9)]
  const tdInv = inverse(td)
  if (!tdInv) throw new RangeError('degenerate destination points')
  return normaliseHomography(matMul(matMul(tdInv, hn), ts))
}

function accumulate(ata: Matrix, row: number[]): void {
  for (let i = 0; i < 9; i++) for (let j = 0; j < 9; j++) ata[i][j] += row[i] * row[j]
}

/** Distance between each mapped src point and its dst point, in dst units. */
export function reprojectionErrors(h: Homography, src: readonly Vec2[], dst: readonly Vec2[]): number[] {
  return src.map((p, i) => {
    const q = applyHomography(h, p)
    return Math.hypot(q[0] - dst[i][0], q[1] - dst[i][1])
  })
}

/** Root-mean-square reprojection residual in dst units. */
export function reprojectionRms(h: Homography, src: readonly Vec2[], dst: readonly Vec2[]): number {
  const e = reprojectionErrors(h, src, dst)
  return Math.sqrt(e.reduce((s, v) => s + v * v, 0) / e.length)
}

export interface RobustHomography {
  h: Homography
  /** Indices of the correspondences within the threshold of the final fit. */
  inliers: number[]
  /** RMS residual over the inliers, dst units. */
  rms: number
}

/** Deterministic pseudo-random generator (Park–Miller), so a robust fit is reproducible for the same input. */
function lehmer(seed: number): () => number {
  let s = seed % 2147483647 || 1
  return () => (s = (s * 16807) % 2147483647) / 2147483647
}

/**
 * RANSAC over 4-point samples, then a normalised DLT refit on the inliers, repeated until the inlier set is stable.
 * thresholdDst is the inlier distance in dst units (e.g. 3 px). Throws when fewer than 4 inliers survive.
 */
export function fitHomographyRobust(
  src: readonly Vec2[],
  dst: readonly Vec2[],
  opts: { thresholdDst: number; iterations?: number; seed?: number },
): RobustHomography {
  const n = src.length
  if (n < 4 || dst.length !== n) throw new RangeError('homography needs ≥ 4 point pairs')
  const rnd = lehmer(opts.seed ?? 12345)
  let best: number[] = []
  for (let it = 0; it < (opts.iterations ?? 300) && best.length < n; it++) {
    const pick = new Set<number>()
    while (pick.size < 4) pick.add(Math.floor(rnd() * n))
    const idx = [...pick]
    let h: Homography
    try {
      h = fitHomography(idx.map((i) => src[i]), idx.map((i) => dst[i]))
    } catch {
      continue
    }
    const inl = inliersOf(h, src, dst, opts.thresholdDst)
    if (inl.length > best.length) best = inl
  }
  return refine(src, dst, best, opts.thresholdDst)
}

function inliersOf(h: Homography, src: readonly Vec2[], dst: readonly Vec2[], t: number): number[] {
  return reprojectionErrors(h, src, dst).flatMap((e, i) => (e <= t ? [i] : []))
}

function refine(src: readonly Vec2[], dst: readonly Vec2[], start: number[], t: number): RobustHomography {
  let inliers = start
  for (let round = 0; round < 10; round++) {
    if (inliers.length < 4) throw new RangeError('robust homography: fewer than 4 inliers')
    const h = fitHomography(inliers.map((i) => src[i]), inliers.map((i) => dst[i]))
    const next = inliersOf(h, src, dst, t)
    if (next.length === inliers.length && next.every((v, k) => v === inliers[k])) {
      const rms = reprojectionRms(h, inliers.map((i) => src[i]), inliers.map((i) => dst[i]))
      return { h, inliers, rms }
    }
    inliers = next
  }
  const h = fitHomography(inliers.map((i) => src[i]), inliers.map((i) => dst[i]))
  return { h, inliers, rms: reprojectionRms(h, inliers.map((i) => src[i]), inliers.map((i) => dst[i])) }
}
