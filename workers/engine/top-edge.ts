import type { Cv } from './opencv'
import type { GreyImage } from './image'
import type { Calibration } from './calibrate'
import type { CardShade } from './shade'
import { BEHIND_CARD, cardToStrip, localScale, rectify, stripToCard, type Strip } from './rectify'
import { refineAlongNormals, sharpOnly, type EdgeSample } from './trace'
import type { Mat3, Pt } from './projective'
import { MAX_RUNNER_HEIGHT_MM, MIN_RUNNER_HEIGHT_MM, chooseLine, residual } from './top-edge-line'
import { median } from './stats'

/**
 * The runner's top edge where it shows between the mounting plates, in card mm on the runner's plane: the stretches
 * of one straight line, each ordered by card x, and the points' scatter about it.
 */
export interface TopEdge {
  stretchesMm: Pt[][]
  /** Scatter of the edge points about the fitted line, mm (1 sigma). */
  scatterMm: number
  /** Location error of a point for the runner height's ±: the scatter or the systematic floor, mm (1 sigma). */
  sigmaMm: number
}

/**
 * Top-edge location error that does not average out, photo px: a boot's soft shadow on the card just above the edge
 * shifts stretches of it by up to about half a pixel on the synthetic photos (measured), far more than the scatter.
 */
export const SYSTEMATIC_TOP_PX = 1

/** The walk up a column starts this far above the bottom edge: always inside the runner's steel, mm. */
const START_ABOVE_BOTTOM_MM = 8
/** Columns are searched every this many mm along card x. */
const COLUMN_STEP_MM = 0.5

/**
 * The bottom edge's lowest y (card mm, y down) in each 0.5 mm of card x — the running surface, not a pick's face —
 * interpolated across gaps in the traced edge (where the steel meets the table with little contrast): it only places
 * the column searches, so a rocker's sag over a gap (0.13 mm over 45 mm at 2 m) does not matter.
 */
function bottomProfile(bottomMm: Pt[]): (x: number) => number | null {
  const x0 = Math.min(...bottomMm.map((p) => p[0]))
  const bins = new Map<number, number>()
  for (const [x, y] of bottomMm) {
    const k = Math.round((x - x0) / COLUMN_STEP_MM)
    bins.set(k, Math.max(bins.get(k) ?? -Infinity, y))
  }
  const keys = [...bins.keys()].sort((a, b) => a - b)
  return (x) => {
    const f = (x - x0) / COLUMN_STEP_MM
    if (f < keys[0] || f > keys[keys.length - 1]) return null
    const hi = keys.findIndex((k) => k >= f)
    if (keys[hi] === f || hi === 0) return bins.get(keys[hi])!
    const [a, b] = [keys[hi - 1], keys[hi]]
    return bins.get(a)! + ((bins.get(b)! - bins.get(a)!) * (f - a)) / (b - a)
  }
}

interface Column {
  u: number
  /** Coarse top edge, strip px (v grows downward). */
  v: number
  bottomV: number
}

/**
 * Walks up one strip column from inside the runner to where the steel ends for at least `runPx` pixels: the coarse
 * top edge, or null when the column stays steel-like (a plate, or a boot as dark as the steel) or ends out of range.
 */
function walkUp(strip: Strip, u: number, bottomV: number, darker: boolean, steel: number): number | null {
  const { width, height, data } = strip.img
  const r = strip.pxPerMm
  const runPx = Math.max(2, Math.round(0.75 * r))
  const from = Math.round(bottomV - START_ABOVE_BOTTOM_MM * r)
  const to = Math.max(0, Math.round(bottomV - (MAX_RUNNER_HEIGHT_MM + 2) * r))
  let outside = 0
  for (let v = from; v >= to; v--) {
    if (v >= height) continue
    const i = v * width + u
    if (strip.inside[i] !== BEHIND_CARD) return null
    let sum = 0
    for (let du = -1; du <= 1; du++) sum += data[v * width + Math.min(width - 1, Math.max(0, u + du))]
    const mid = (steel * strip.shade[i] + strip.shade[i]) / 2
    const isSteel = darker ? sum / 3 < mid : sum / 3 > mid
    outside = isSteel ? 0 : outside + 1
    if (outside >= runPx) return v + runPx - 0.5
  }
  return null
}

/** Median brightness of the runner over the card's expected brightness, 5–12 mm above its bottom edge. */
function steelRatioAbove(strip: Strip, columns: { u: number; bottomV: number }[]): number {
  const r = strip.pxPerMm
  const values: number[] = []
  for (const { u, bottomV } of columns) {
    for (let v = Math.round(bottomV - 12 * r); v <= bottomV - 5 * r; v += Math.max(1, Math.round(r / 2))) {
      if (v < 0 || v >= strip.img.height) continue
      const i = v * strip.img.width + u
      if (strip.inside[i] === BEHIND_CARD) values.push(strip.img.data[i] / strip.shade[i])
    }
  }
  return median(values)
}

/** Splits coarse points into runs whose neighbours lie within a millimetre of each other. */
function runsOf(columns: Column[], r: number): Column[][] {
  const runs: Column[][] = []
  for (const c of columns) {
    const run = runs[runs.length - 1]
    const last = run?.[run.length - 1]
    if (last && c.u - last.u <= 2 * COLUMN_STEP_MM * r && Math.abs(c.v - last.v) <= r) run.push(c)
    else runs.push([c])
  }
  return runs.filter((run) => run.length >= 6)
}

/** Refines each run of coarse points to the steel-to-card gradient peak along its upward normal. */
function refine(strip: Strip, runs: Column[][], steelRatio: number): EdgeSample[] {
  const r = strip.pxPerMm
  const w = strip.img.width
  const shadeAt = (u: number, v: number) =>
    strip.shade[Math.min(strip.shade.length - 1, Math.max(0, Math.round(v) * w + Math.round(u)))]
  const out: EdgeSample[] = []
  for (const run of runs) {
    // Ordered right to left, the path's left-hand normal (−ty, tx) points up, out of the steel below the edge.
    const coarse = run.map((c): Pt => [c.u, c.v]).reverse()
    out.push(...refineAlongNormals(strip, coarse, {
      insidePx: 2.5 * r, outsidePx: 2.5 * r, darker: steelRatio < 1, tableAt: () => false, steelRatio, shadeAt,
    }))
  }
  // Shadow outlines blur with their depth; the steel's own edge is as sharp as the bottom edge.
  return sharpOnly(out)
}

/** Keeps samples with card above them: 1.5–3 mm beyond the edge the strip is as bright as card, or as card in shadow. */
function cardAbove(strip: Strip, samples: EdgeSample[]): EdgeSample[] {
  const r = strip.pxPerMm
  const w = strip.img.width
  return samples.filter((s) => {
    let sum = 0
    let n = 0
    for (let d = 1.5 * r; d <= 3 * r; d++) {
      const v = Math.round(s.p[1] - d)
      const u = Math.round(s.p[0])
      if (v < 0) break
      sum += strip.img.data[v * w + u] / strip.shade[v * w + u]
      n++
    }
    // A shadow on the card darkens it by up to half; a boot may be far darker or lighter than card.
    return n > 0 && sum / n >= CARD_ABOVE[0] && sum / n <= CARD_ABOVE[1]
  })
}

/** Brightness over the card's expected brightness that still reads as card above the edge (shadow to glare). */
const CARD_ABOVE = [0.45, 1.15] as const

/**
 * Traces the runner's top edge in a rectified strip of the runner's plane: walks up each column from inside the
 * runner to where the steel ends, refines that point to the gradient peak along the normal, keeps points with card
 * above them, and chooses the straight line between the mounting plates lying 15–40 mm above the bottom edge
 * (bottomMm: card mm, ordered from the toe). Null when no such edge shows, or when it cannot be told apart.
 */
export function traceTopEdge(strip: Strip, bottomMm: Pt[], photoPxPerMm: number): TopEdge | null {
  const r = strip.pxPerMm
  const bottomAt = bottomProfile(bottomMm)
  const xs = bottomMm.map((p) => p[0])
  const candidates: { u: number; bottomV: number }[] = []
  for (let x = Math.min(...xs); x <= Math.max(...xs); x += COLUMN_STEP_MM) {
    const y = bottomAt(x)
    if (y === null) continue
    const [u, bottomV] = cardToStrip(strip, [x, y])
    if (u >= 1 && u < strip.img.width - 1) candidates.push({ u: Math.round(u), bottomV })
  }
  const ratio = steelRatioAbove(strip, candidates)
  if (!Number.isFinite(ratio) || Math.abs(ratio - 1) < 0.08) return null
  const columns: Column[] = []
  for (const c of candidates) {
    const v = walkUp(strip, c.u, c.bottomV, ratio < 1, ratio)
    if (v === null) continue
    const height = (c.bottomV - v) / r
    if (height >= MIN_RUNNER_HEIGHT_MM && height <= MAX_RUNNER_HEIGHT_MM) columns.push({ u: c.u, v, bottomV: c.bottomV })
  }
  const samples = cardAbove(strip, refine(strip, runsOf(columns, r), ratio))
  const pts = samples.map((s) => stripToCard(strip, s.p[0], s.p[1])).sort((a, b) => a[0] - b[0])
  if (pts.length < 10) return null
  const toeX = bottomMm[0][0]
  const heelX = bottomMm[bottomMm.length - 1][0]
  const chosen = chooseLine(pts, { bottomAt, along: (x) => (x - toeX) / (heelX - toeX), lengthMm: Math.abs(heelX - toeX) })
  if (!chosen) return null
  const res = chosen.parts.flat().map((p) => Math.abs(residual(chosen.line, p)))
  const scatterMm = 1.4826 * median(res)
  return { stretchesMm: chosen.parts, scatterMm, sigmaMm: Math.max(scatterMm, SYSTEMATIC_TOP_PX / photoPxPerMm) }
}

/** Card-mm band of the runner plane to rectify for the top edge: above the running part of the bottom edge. */
function band(bottomMm: Pt[]): { x0: number; x1: number; y0: number; y1: number } {
  const lowest = Math.max(...bottomMm.map((p) => p[1]))
  const running = bottomMm.filter((p) => p[1] >= lowest - MIN_RUNNER_HEIGHT_MM)
  const xs = running.map((p) => p[0])
  const ys = running.map((p) => p[1])
  return {
    x0: Math.min(...xs), x1: Math.max(...xs),
    y0: Math.min(...ys) - MAX_RUNNER_HEIGHT_MM - 4, y1: lowest - 4,
  }
}

/** What the top-edge search needs of a traced blade (a subset of BladeEdge). */
export interface TracedBottom {
  edgeMm: Pt[]
  planeHomography: Mat3
  pxPerMm: number
}

/**
 * Hook for the engine's pipeline: rectifies the band of the runner's plane above a traced bottom edge and traces the
 * top edge there. Where the pipeline already holds a strip covering that band, call traceTopEdge on it instead.
 */
export function findTopEdge(cv: Cv, img: GreyImage, cal: Calibration, bottom: TracedBottom, shade: CardShade, tableY: number): TopEdge | null {
  const b = band(bottom.edgeMm)
  const strip = rectify(cv, img, bottom.planeHomography, cal.distortion, shade, {
    ...b, pxPerMm: bottom.pxPerMm, cardHomography: cal.homography, tableY,
  })
  const photoPxPerMm = localScale(bottom.planeHomography, [(b.x0 + b.x1) / 2, (b.y0 + b.y1) / 2])
  return traceTopEdge(strip, bottom.edgeMm, photoPxPerMm)
}
