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
