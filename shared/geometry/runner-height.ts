import type { BladeFrame } from './frames'
import { cardToBlade } from './frames'
import { COVERAGE_K } from './uncertainty'
import type { Vec2 } from './vec'
import { interpolateY } from './vec'

/**
 * Runner height (DESIGN §6): at fixed stations along the support line L, the distance from the running surface (the
 * bottom edge) up to the runner's top edge, both in the blade frame (x along L from B toward the heel, y up, mm).
 * Only where the top edge shows at the station: no station is filled in across a part the photo did not show.
 */
export interface RunnerHeightStation {
  /** Station, mm along L from B. */
  alongMm: number
  /** Top edge minus bottom edge, perpendicular to L, mm. */
  heightMm: number
  /** ± of the height, mm (COVERAGE_K σ). */
  plusMinusMm: number
}

export interface RunnerHeightInput {
  frame: BladeFrame
  /** Bottom edge in card mm (x right, y down), ordered toe → heel. */
  bottomCardMm: readonly Vec2[]
  /** Visible stretches of the runner's top edge, card mm. */
  topCardMm: readonly (readonly Vec2[])[]
  /** The running surface: stations lie between these, mm along L (the rocker start and the heel end E). */
  fromAlongMm: number
  toAlongMm: number
  /** 1σ location error of a bottom-edge point and of a top-edge point (each including its systematic part), mm. */
  bottomSigmaMm: number
  topSigmaMm: number
  /** Card calibration residual (1σ, mm), taken as a height error as elsewhere in the profile's ±. */
  calibrationSigmaMm: number
  /** Station spacing, mm (default 10). */
  stepMm?: number
}

/** Half-width of the window each edge's height is averaged over at a station, mm. */
const TOP_HALF_WINDOW_MM = 2
const BOTTOM_HALF_WINDOW_MM = 1
/**
 * Across a gap in the traced bottom edge up to this long, its height is interpolated (a 1 m rocker sags 2 µm over
 * it); longer gaps leave the station out, since the points either side of a gap are the least reliable, mm.
 */
const MAX_BOTTOM_GAP_MM = 4

/** Mean y of the points within ±half of x, if at least three; else null. */
function meanNear(points: readonly Vec2[], x: number, half: number): number | null {
  let sum = 0
  let n = 0
  for (const p of points) {
    if (Math.abs(p[0] - x) <= half) {
      sum += p[1]
      n++
    }
  }
  return n >= 3 ? sum / n : null
}

/**
 * Height of a polyline (sorted by x) at x: averaged over ±half where it has points there, else interpolated between
 * the nearest points either side when they are at most maxGap apart; null otherwise.
 */
export function heightAt(sorted: readonly Vec2[], x: number, half: number, maxGap: number): number | null {
  const mean = meanNear(sorted, x, half)
  if (mean !== null) return mean
  const after = sorted.findIndex((p) => p[0] >= x)
  if (after <= 0 || sorted[after][0] - sorted[after - 1][0] > maxGap) return null
  return interpolateY(sorted, x)
}

/** The stretch covering [x − half, x + half], if one does. */
function stretchAt(stretches: readonly Vec2[][], x: number, half: number): Vec2[] | null {
  return stretches.find((s) => s[0][0] <= x - half && s[s.length - 1][0] >= x + half) ?? null
}

const byX = (points: readonly Vec2[]) => [...points].sort((a, b) => a[0] - b[0])

/**
 * Runner height at every stepMm of alongMm between fromAlongMm and toAlongMm where the top edge shows: the mean
 * height of the top edge over ±2 mm minus that of the bottom edge over ±1 mm. The ± combines the two edges' point
 * errors and the calibration residual (a systematic shift of a traced edge does not average out over a window).
 */
export function runnerHeights(input: RunnerHeightInput): RunnerHeightStation[] {
  const step = input.stepMm ?? 10
  const bottom = byX(input.bottomCardMm.map((p) => cardToBlade(input.frame, p)))
  const tops = input.topCardMm.map((s) => byX(s.map((p) => cardToBlade(input.frame, p)))).filter((s) => s.length >= 3)
  const plusMinusMm = COVERAGE_K * Math.hypot(input.bottomSigmaMm, input.topSigmaMm, input.calibrationSigmaMm)
  const out: RunnerHeightStation[] = []
  for (let x = Math.ceil(input.fromAlongMm / step) * step; x <= input.toAlongMm; x += step) {
    const stretch = stretchAt(tops, x, TOP_HALF_WINDOW_MM)
    const top = stretch ? meanNear(stretch, x, TOP_HALF_WINDOW_MM) : null
    const low = heightAt(bottom, x, BOTTOM_HALF_WINDOW_MM, MAX_BOTTOM_GAP_MM)
    if (top === null || low === null) continue
    out.push({ alongMm: x, heightMm: top - low, plusMinusMm })
  }
  return out
}

/** The lowest station of a runner-height profile, or null when the top edge showed nowhere. */
export function lowestStation(stations: readonly RunnerHeightStation[]): RunnerHeightStation | null {
  return stations.reduce<RunnerHeightStation | null>((low, s) => (low === null || s.heightMm < low.heightMm ? s : low), null)
}

/** Height lost at each station both profiles measured (earlier − later, mm, + = lower now), with its ±. */
export function heightLoss(
  earlier: readonly RunnerHeightStation[],
  later: readonly RunnerHeightStation[],
): { alongMm: number; lossMm: number; plusMinusMm: number }[] {
  return later.flatMap((s) => {
    const e = earlier.find((q) => q.alongMm === s.alongMm)
    return e ? [{ alongMm: s.alongMm, lossMm: e.heightMm - s.heightMm, plusMinusMm: Math.hypot(e.plusMinusMm, s.plusMinusMm) }] : []
  })
}
