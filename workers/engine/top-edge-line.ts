import { fitLineYOnX } from '../../shared/geometry/vec'
import type { Pt } from './projective'

/**
 * Choosing the runner's top edge among candidate edge points (card mm): the straight line between the mounting
 * plates, its stretches, and when nothing can be told apart. Used by top-edge.ts, which finds the points.
 */

/** The runner's top edge lies this far above its bottom edge (DESIGN §6; runners are 25–30 mm tall new), mm. */
export const MIN_RUNNER_HEIGHT_MM = 15
export const MAX_RUNNER_HEIGHT_MM = 40

export interface Line {
  slope: number
  intercept: number
}

/** Distance of a point from a line, perpendicular to it (+ below it in card y), mm. */
export const residual = (l: Line, p: Pt) => (p[1] - (l.slope * p[0] + l.intercept)) / Math.sqrt(1 + l.slope * l.slope)

/** Points within `tolMm` of a line (the vertical offset against the tolerance scaled once, rather than each distance). */
function near(line: Line, pts: Pt[], tolMm: number): Pt[] {
  const limit = tolMm * Math.sqrt(1 + line.slope * line.slope)
  return pts.filter((p) => Math.abs(p[1] - (line.slope * p[0] + line.intercept)) <= limit)
}

/**
 * The line through two of the points (at least `minSpanMm` apart in x) that gathers the most `score` among the
 * points of `scored` within `tolMm` of it, polished by least squares on the points of `pts` near it. Exhaustive over a
 * thinned set of points. The score reads only the points inside the plates' gap, so only those are passed as
 * `scored`: the thousands of candidate lines are the engine's largest cost after the edge fits.
 */
function bestLine(pts: Pt[], scored: Pt[], tolMm: number, minSpanMm: number, score: (inliers: Pt[]) => number): Line | null {
  const step = Math.max(1, Math.floor(pts.length / 120))
  const seeds = pts.filter((_, i) => i % step === 0)
  let best: { line: Line; score: number } | null = null
  for (let i = 0; i < seeds.length; i++) {
    for (let j = i + 1; j < seeds.length; j++) {
      const [a, b] = [seeds[i], seeds[j]]
      if (Math.abs(b[0] - a[0]) < minSpanMm) continue
      const slope = (b[1] - a[1]) / (b[0] - a[0])
      const line = { slope, intercept: a[1] - slope * a[0] }
      const value = score(near(line, scored, tolMm))
      if (!best || value > best.score) best = { line, score: value }
    }
  }
  if (!best || best.score <= 0) return null
  const fit = fitLineYOnX(near(best.line, pts, tolMm))
  return fit && { slope: fit.slope, intercept: fit.intercept }
}

/** Splits x-sorted points into stretches at gaps wider than `gapMm`, keeping stretches at least `minMm` long. */
function stretches(pts: Pt[], gapMm: number, minMm: number): Pt[][] {
  const out: Pt[][] = []
  for (const p of pts) {
    const run = out[out.length - 1]
    if (run && p[0] - run[run.length - 1][0] <= gapMm) run.push(p)
    else out.push([p])
  }
  return out.filter((s) => s[s.length - 1][0] - s[0][0] >= minMm)
}

const lengthOf = (parts: Pt[][]) => parts.reduce((s, part) => s + part[part.length - 1][0] - part[0][0], 0)

/** How far the top edge's points may lie from one straight line, mm: a few times the sub-pixel edge's own scatter. */
const LINE_TOLERANCE_MM = 0.3
/** Shortest stretch reported, and the least length of top edge inside the plates' gap that counts as found, mm. */
const MIN_STRETCH_MM = 5
const MIN_FOUND_MM = 15
/** Most the top edge's direction may differ from the bottom edge's chord beneath it, radians (4°). */
const MAX_ANGLE_RAD = 0.07
/**
 * Where the gap between the mounting plates lies, as fractions of the traced length from the toe: the runner's top
 * edge shows there, while over the plates the boot's sole or a plate's top can make an edge just as straight. Our
 * convention: the gap's middle lies at 43–48 % of the length on the generated blades, and on the blades we know (from
 * memory, no published source).
 */
const GAP_WINDOW = [0.33, 0.57] as const
/** A second line this close in support inside the gap window makes the choice ambiguous, and nothing is reported. */
const AMBIGUOUS_SHARE = 0.5

/** The traced bottom edge as the choice needs it. */
export interface Placed {
  bottomAt: (x: number) => number | null
  /** Fraction of the blade's length from the toe at card x. */
  along: (x: number) => number
  /** Traced length of the blade along card x, mm. */
  lengthMm: number
}

/** The runner's height at an edge point: the bottom edge's card y there minus the point's, mm. */
function heightOf(b: Placed, p: Pt): number {
  return (b.bottomAt(p[0]) ?? -Infinity) - p[1]
}

/** Whether a line runs within MAX_ANGLE_RAD of the bottom edge's chord between card x0 and x1. */
function parallel(b: Placed, line: Line, x0: number, x1: number): boolean {
  const [y0, y1] = [b.bottomAt(x0), b.bottomAt(x1)]
  if (y0 === null || y1 === null || x1 - x0 < 10) return false
  return Math.abs(Math.atan(line.slope) - Math.atan((y1 - y0) / (x1 - x0))) <= MAX_ANGLE_RAD
}

/**
 * The stretches of the chosen line that can be the runner's top edge: the one with the most length in the plates'
 * gap, others lying wholly in the gap, and one behind the heel plate reaching the tail (the runner's top runs on to
 * the heel end there). Ahead of the toe plate no top edge shows (the plate runs to the picks), and a stretch running
 * out of the gap over a plate may be a boot's sole that happens to line up with the top edge.
 */
function plausibleStretches(b: Placed, parts: Pt[][]): Pt[][] {
  const span = (part: Pt[]) => {
    const ends = [b.along(part[0][0]), b.along(part[part.length - 1][0])]
    return [Math.min(...ends), Math.max(...ends)]
  }
  const inGap = (part: Pt[]) => {
    const [from, to] = span(part)
    return Math.max(0, Math.min(to, GAP_WINDOW[1]) - Math.max(from, GAP_WINDOW[0]))
  }
  const core = parts.reduce<Pt[] | null>((best, part) => (!best || inGap(part) > inGap(best) ? part : best), null)
  return parts.filter((part) => {
    const [from, to] = span(part)
    const wholly = from >= GAP_WINDOW[0] && to <= GAP_WINDOW[1]
    const tail = from > GAP_WINDOW[1] && (1 - to) * b.lengthMm <= TAIL_REACH_MM
    return part === core || wholly || tail
  })
}

/**
 * A stretch behind the heel plate counts as the tail's top edge when it comes this close to the heel end, mm: the tail's
 * top runs to the heel face (measured: within 6 mm on the generated photos), while a boot's sole over the heel plate
 * that lines up with the top edge stops 10 mm or more short of it.
 */
const TAIL_REACH_MM = 8

/**
 * Chooses the runner's top edge among the edge points: the straight line with the most length inside the plates' gap,
 * unless a second line comes close (then the boot or a plate cannot be told from the runner, and null), and keeps the
 * line's points 15–40 mm above the bottom edge anywhere along the blade (behind the heel plate too).
 */
export function chooseLine(pts: Pt[], b: Placed): { line: Line; parts: Pt[][] } | null {
  const inGap = (p: Pt) => b.along(p[0]) >= GAP_WINDOW[0] && b.along(p[0]) <= GAP_WINDOW[1]
  const stretchLength = (gapPoints: Pt[]) => lengthOf(stretches(gapPoints, 2, MIN_STRETCH_MM))
  const gapLength = (inliers: Pt[]) => stretchLength(inliers.filter(inGap))
  const first = bestLine(pts, pts.filter(inGap), LINE_TOLERANCE_MM, 10, stretchLength)
  if (!first) return null
  const firstIn = near(first, pts, LINE_TOLERANCE_MM)
  const support = gapLength(firstIn)
  if (support < MIN_FOUND_MM) return null
  const rest = pts.filter((p) => Math.abs(residual(first, p)) > 1)
  const second = rest.length >= 10 ? bestLine(rest, rest.filter(inGap), LINE_TOLERANCE_MM, 10, stretchLength) : null
  if (second && gapLength(near(second, rest, LINE_TOLERANCE_MM)) >= AMBIGUOUS_SHARE * support) return null
  const kept = firstIn.filter((p) => heightOf(b, p) >= MIN_RUNNER_HEIGHT_MM && heightOf(b, p) <= MAX_RUNNER_HEIGHT_MM)
  const parts = plausibleStretches(b, stretches(kept, 2, MIN_STRETCH_MM))
  const gapParts = parts.flat().filter(inGap)
  if (!gapParts.length || !parallel(b, first, gapParts[0][0], gapParts[gapParts.length - 1][0])) return null
  return { line: first, parts }
}

