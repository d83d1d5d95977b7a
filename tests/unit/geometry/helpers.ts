import type { Vec2 } from '../../../shared/geometry/vec'

/** Seeded Park–Miller generator with Box–Muller normals, so noisy tests are reproducible. */
export function rng(seed: number) {
  let s = seed % 2147483647 || 1
  const uniform = () => (s = (s * 16807) % 2147483647) / 2147483647
  const normal = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform())
  return { uniform, normal }
}

/** Adds isotropic Gaussian noise of sigmaMm to every point. */
export function withNoise(points: readonly Vec2[], sigmaMm: number, seed: number): Vec2[] {
  const { normal } = rng(seed)
  return points.map((p): Vec2 => [p[0] + normal() * sigmaMm, p[1] + normal() * sigmaMm])
}

/**
 * Adds noise of sigmaMm, then averages it over `width` neighbouring points, as an image engine's smoothing does:
 * the per-point scatter drops by about √width, but neighbouring errors are shared.
 */
export function withSmoothedNoise(points: readonly Vec2[], sigmaMm: number, width: number, seed: number): Vec2[] {
  const { normal } = rng(seed)
  const raw = points.map((): Vec2 => [normal() * sigmaMm, normal() * sigmaMm])
  const half = width >> 1
  return points.map((p, i): Vec2 => {
    let [sx, sy, n] = [0, 0, 0]
    for (let k = Math.max(0, i - half); k <= Math.min(points.length - 1, i + half); k++) {
      sx += raw[k][0]
      sy += raw[k][1]
      n++
    }
    return [p[0] + sx / n, p[1] + sy / n]
  })
}
