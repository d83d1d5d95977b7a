import { isToothTip } from '../../shared/geometry/support-line'
import { dist } from '../../shared/geometry/vec'
import { cumulative } from './clean'
import { sample } from './image'
import { cardToStrip, stripToCard, type Strip } from './rectify'
import { fitLine, intersect, type Line } from './subpixel'
import { fitTipModel } from './tip-model'

type Pt = [number, number]

/** Teeth whose tips lie this far above the lowest one cannot hold the base pick (the next tooth rises 3 mm or more), mm. */
const LOWEST_TIPS_BAND_MM = 1.5
/** A tooth tip is the lowest point within this arc either side, mm. */
const TIP_NEIGHBOURHOOD_MM = 1
/** Arc-length span either side of a tip whose points give its faces' first slopes, mm (past the blur's rounding). */
const FACE_SPAN_MM: [number, number] = [0.3, 2]
const FACE_FALLBACK_SPAN_MM = 3.5
/** Patch fitted around a tip, mm: well inside the tooth's faces (4 mm and longer), past the blur. */
const PATCH_RADIUS_MM = 1.0
/** ... but at least this many pixels, so a coarse photo still gives the fit enough of each face. */
const MIN_PATCH_RADIUS_PX = 9
const MAX_PATCH_RADIUS_MM = 1.6
/** A fit that moves the tip further than this from its start, or turns a face more, found something else, mm and °. */
const MAX_MOVE_MM = 0.45
const MAX_TURN_DEG = 20
/** More move allowed to a rebuilt tip that comes back toward the trace (moveAllowanceMm), mm. */
const MAX_EXTRA_MOVE_MM = 0.5
/** Spacing of the traced edge's points, mm: a neighbour farther than this from the tip marks a rebuilt tip. */
const TRACED_SPACING_MM = 0.5
/** The faces may meet this far from the traced tip when the trace lost the tip's last few tenths, mm. */
const MAX_START_SHIFT_MM = 1
/** Least steel-to-background contrast the fit must find, grey levels. */
const MIN_CONTRAST = 12

function turnDeg(a: number, b: number): number {
  return Math.abs(Math.atan(a) - Math.atan(b)) * (180 / Math.PI)
}

/**
 * Indices of the tooth tips among the edge's first `zoneMm` (card x from its toe end): points lower (y down) than
 * every point within TIP_NEIGHBOURHOOD_MM and than their immediate neighbours (the trace thins out at a tip), with a
 * tooth's face rising from them both ways (the geometry's own test of a tooth tip, `isToothTip`).
 */
function toothTips(edge: Pt[], s: Float64Array, zoneMm: number): number[] {
  // isToothTip reads a y-up edge toward its start: the edge flipped upright, forward for the front face, reversed
  // for the back face.
  const upright: Pt[] = edge.map(([x, y]) => [x, -y])
  const reversed = [...upright].reverse()
  const n = edge.length
  const lowestOnSide = (i: number, step: -1 | 1): boolean => {
    for (let j = i + step; j >= 0 && j < n && (j === i + step || Math.abs(s[j] - s[i]) <= TIP_NEIGHBOURHOOD_MM); j += step)
      if (edge[j][1] >= edge[i][1]) return false
    return true
  }
  const out: number[] = []
  for (let i = 1; i < n - 1 && Math.abs(edge[i][0] - edge[0][0]) <= zoneMm; i++) {
    if (lowestOnSide(i, -1) && lowestOnSide(i, 1) && isToothTip(upright, i) && isToothTip(reversed, n - 1 - i)) out.push(i)
  }
  return out
}

/**
 * The face on one side of tip i: a line through the points FACE_SPAN_MM away along the edge (past the rounding, short
 * of the face's far end), or through the first three past the rounding where the trace thinned out near the tip.
 */
function faceLine(edge: Pt[], s: Float64Array, i: number, side: -1 | 1): Line | null {
  const pts: Pt[] = []
  for (let j = i + side; j >= 0 && j < edge.length; j += side) {
    const d = Math.abs(s[j] - s[i])
    if (d > FACE_SPAN_MM[1] && pts.length >= 3) break
    if (d > FACE_FALLBACK_SPAN_MM) break
    if (d >= FACE_SPAN_MM[0]) pts.push(edge[j])
  }
  const line = fitLine(pts)
  // A face steeper than 30° from the horizontal has a usable slope du/dv.
  return line && Math.abs(line.nx) >= 0.5 ? line : null
}

/**
 * How far a fit may move the tip, mm: MAX_MOVE_MM, and from a tip rebuilt where the faces meet beyond the trace, more
 * when the fit moves it back toward the traced points: the rebuilt point extrapolates faces that may curve near the
 * tip, and overshoots (by up to the extrapolated distance, at most MAX_EXTRA_MOVE_MM more).
 */
export function moveAllowanceMm(edge: Pt[], i: number, start: Pt, fitted: Pt): number {
  const neighbours = [edge[i - 1], edge[i + 1]].filter(Boolean)
  const nearest = (q: Pt) => Math.min(...neighbours.map((p) => dist(p, q)))
  const extrapolated = nearest(start) - TRACED_SPACING_MM
  if (!(extrapolated > 0) || !(nearest(fitted) < nearest(start))) return MAX_MOVE_MM
  return MAX_MOVE_MM + Math.min(MAX_EXTRA_MOVE_MM, extrapolated)
}

/** Slope du/dv (= dx/dy) of a line n·p = c: its direction is (ny, −nx). */
function slopeOf(line: Line): number {
  return line.ny / -line.nx
}

/**
 * Puts the lowest tooth tips (the base pick among them) where a model of the blurred scene around each puts them
 * (tip-model.ts), in place of the traced or rebuilt point; a fit that does not hold keeps it. Edge in card mm, toe
 * first, y down; `blurPx` is the edge blur in strip px.
 */
export function refineToothTips(strip: Strip, edge: Pt[], zoneMm: number, blurPx: number): Pt[] {
  const s = cumulative(edge)
  const tips = toothTips(edge, s, zoneMm)
  if (!tips.length) return edge
  const lowest = Math.max(...tips.map((i) => edge[i][1]))
  const r = strip.pxPerMm
  const out = edge.slice()
  for (const i of tips) {
    if (edge[i][1] < lowest - LOWEST_TIPS_BAND_MM) continue
    const before = faceLine(edge, s, i, -1)
    const after = faceLine(edge, s, i, 1)
    if (before === null || after === null) continue
    // Start from where the faces meet: the traced point may lie up a face when the trace lost the tip.
    const meet = intersect(before, after)
    const start = meet && dist(meet, edge[i]) <= MAX_START_SHIFT_MM ? meet : edge[i]
    const tip = cardToStrip(strip, start)
    // The card's bottom edge: where the depth below it of the ray through the tip's pixel falls to zero.
    const depth = sample({ data: strip.tableDepth, width: strip.img.width, height: strip.img.height }, tip[0], tip[1])
    const slopes: [number, number] = [slopeOf(before), slopeOf(after)]
    const radius = Math.min(MAX_PATCH_RADIUS_MM * r, Math.max(MIN_PATCH_RADIUS_PX, PATCH_RADIUS_MM * r))
    const fit = fitTipModel({ img: strip.img, tip, slopes, sigma: Math.max(0.5, blurPx), cardEdgeV: tip[1] - depth, radius })
    if (!fit || fit.contrast < MIN_CONTRAST) continue
    const fitted = stripToCard(strip, fit.tip[0], fit.tip[1])
    if (dist(fit.tip, tip) > moveAllowanceMm(edge, i, start, fitted) * r) continue
    if (turnDeg(fit.slopes[0], slopes[0]) > MAX_TURN_DEG || turnDeg(fit.slopes[1], slopes[1]) > MAX_TURN_DEG) continue
    out[i] = fitted
  }
  return out
}
