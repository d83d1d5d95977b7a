import type { Cv } from './opencv'
import { sample, type GreyImage } from './image'
import type { Calibration } from './calibrate'
import { offsetPlaneHomography } from './camera'
import { BEHIND_TABLE, localScale, rectify, stripToCard, type Strip } from './rectify'
import { segmentBlade, type Silhouette } from './segment'
import type { CardShade } from './shade'
import { lowerPath, refineAlongNormals, sharpOnly, smoothResample, trimExcursions, type EdgeSample } from './trace'
import { EngineRefusal, SURFACE_ADVICE } from './errors'
import { dropOutliers, dropStrayRuns, startAtFirstTip } from './clean'
import { restoreTips } from './tips'
import { refineToothTips } from './tooth-tips'
import type { Mat3, Pt } from './projective'
import { median } from './stats'
import { SYSTEMATIC_EDGE_PX } from '../../shared/geometry/stored-result'

/** Where on the card the blade's silhouette is searched (card mm) and the card's table line. */
export interface BladeZone {
  x0: number
  x1: number
  top: number
  tableY: number
}

export interface BladeEdge {
  /** Bottom edge in card-frame mm on the runner's plane, ordered from the toe-pick tips to the heel end. */
  edgeMm: Pt[]
  toe: 'left' | 'right'
  /** Card mm (runner plane) → undistorted photo px. */
  planeHomography: Mat3
  /** Median blur of the edge (Gaussian sigma), mm and photo px. */
  blurMm: number
  blurPx: number
  /** Scatter of the edge about a smooth curve, mm (1 sigma). */
  edgeScatterMm: number
  /** Edge uncertainty for the metrics' ±: the scatter or the systematic floor, whichever is larger, mm (1 sigma). */
  edgeSigmaMm: number
  /** Share of the traced outline that gave a clean sub-pixel edge. */
  coverage: number
  darkerSteel: boolean
  pxPerMm: number
}

const MARGIN_BELOW_TABLE_MM = 6
/** Blur (Gaussian sigma of the edge) beyond which the edge cannot be located well enough, mm and photo px. */
export const MAX_BLUR_MM = 0.45
export const MAX_BLUR_PX = 6

/** Scatter of consecutive edge points about the local straight line through their neighbours (1 sigma, mm). */
function edgeScatterMm(edge: Pt[]): number {
  const r: number[] = []
  for (let i = 2; i < edge.length - 2; i++) {
    const a = edge[i - 2]
    const b = edge[i + 2]
    const len = Math.hypot(b[0] - a[0], b[1] - a[1])
    if (len === 0) continue
    const d = ((b[0] - a[0]) * (edge[i][1] - a[1]) - (b[1] - a[1]) * (edge[i][0] - a[0])) / len
    r.push(Math.abs(d))
  }
  // A point's distance to the chord of its ±2 neighbours has about 1.2 × the points' own scatter (computed).
  return (1.4826 * median(r)) / 1.22
}

/**
 * Number of teeth near one end of the edge: local lowest points (card y down, so local maxima of y) standing out by
 * at least `prominenceMm` on both sides, within `reachMm` of that end and within `lowMm` of the edge's lowest point.
 * The toe picks give several; the heel, which only curves up, none.
 */
function teethNear(edge: Pt[], fromLeft: boolean, reachMm: number, lowMm: number, prominenceMm: number): number {
  const xs = edge.map((p) => p[0])
  const end = fromLeft ? Math.min(...xs) : Math.max(...xs)
  const bottom = Math.max(...edge.map((p) => p[1]))
  const part = edge.filter((p) => Math.abs(p[0] - end) <= reachMm && bottom - p[1] <= lowMm)
  // Zigzag with hysteresis: a tip counts when the edge, having come down to it, rises again by the prominence.
  let count = 0
  let falling = true
  let extreme = part.length ? part[0][1] : 0
  for (const [, y] of part) {
    if (falling) {
      if (y > extreme) extreme = y
      else if (extreme - y >= prominenceMm) {
        count++
        falling = false
        extreme = y
      }
    } else if (y < extreme) extreme = y
    else if (y - extreme >= prominenceMm) {
      falling = true
      extreme = y
    }
  }
  return count
}

/** Refuses when the traced edge reaches an end of the strip (the blade zone's end) or the photo's border. */
function checkCutOff(path: Pt[], strip: Strip, tableV: number): void {
  const w = strip.img.width
  const margin = 2
  // Only the runner's low part counts: a boot reaching past the zone's end (it is longer than the blade) does not.
  const low = path.filter(([, v]) => v > tableV - RUNNER_BAND_MM * strip.pxPerMm)
  if (low.some(([u]) => u <= margin || u >= w - 1 - margin))
    throw new EngineRefusal('BLADE_CUT_OFF', 'edge reaches the end of the blade zone')
  for (const [u, v] of low) {
    for (const [du, dv] of [[-2, 0], [2, 0], [0, 2], [0, -2]]) {
      const uu = u + du
      const vv = v + dv
      if (uu >= 0 && uu < w && vv >= 0 && vv < strip.img.height && !strip.inside[vv * w + uu])
        throw new EngineRefusal('BLADE_CUT_OFF', 'edge reaches the photo border')
    }
  }
}

/** Height above the table line within which the runner's bottom edge lies (toe picks included), mm. */
const RUNNER_BAND_MM = 30

/** Toe-pick teeth lie within this arc length of the edge's toe end, mm; their corners are restored there. */
const TOE_PICK_ZONE_MM = 45

/**
 * Height above the table line below which the outline is taken for the toe picks' faces and the rocker, never for a
 * boot or a plate (those sit on top of a runner 20 mm tall or more), mm.
 */
const TOE_PICK_HEIGHT_MM = 20

/** How far the edge search reaches into the steel and out of it, mm: past the widest shadow the runner casts. */
const SEARCH_INSIDE_MM = 6
const SEARCH_OUTSIDE_MM = 2.5

function traceSamples(strip: Strip, sil: Silhouette, tableV: number): EdgeSample[] {
  const r = strip.pxPerMm
  const ratio = sil.steelRatio
  const path = trimExcursions(lowerPath(sil.outline), r, tableV - TOE_PICK_HEIGHT_MM * r).filter(([, v]) => v > 1.5 * r)
  if (path.length < 20) throw new EngineRefusal('BLADE_NOT_FOUND', 'no lower outline')
  checkCutOff(path, strip, tableV)
  const coarse = smoothResample(path, Math.max(2, Math.round(0.6 * r)), 0.25 * r)
  const w = strip.img.width
  const samples = refineAlongNormals(strip, coarse, {
    insidePx: SEARCH_INSIDE_MM * r, outsidePx: SEARCH_OUTSIDE_MM * r, darker: ratio < 1,
    tableAt: (u, v) => strip.inside[Math.min(strip.inside.length - 1, Math.max(0, Math.round(v) * w + Math.round(u)))] === BEHIND_TABLE,
    steelRatio: ratio,
    shadeAt: (u, v) => strip.shade[Math.min(strip.shade.length - 1, Math.max(0, Math.round(v) * w + Math.round(u)))],
    tableDepthAt: (u, v) => sample({ data: strip.tableDepth, width: w, height: strip.img.height }, u, v),
  })
  return sharpOnly(samples)
}

/**
 * Finds the runner in the card's blade zone and traces its bottom edge with sub-pixel accuracy, on the plane
 * `offsetMm` in front of the card (where the runner's near face stands).
 */
export function traceBlade(cv: Cv, img: GreyImage, cal: Calibration, zone: BladeZone, offsetMm: number, shade: CardShade): BladeEdge {
  const planeHomography = offsetPlaneHomography(cal.pose, cal.distortion, -offsetMm)
  const centre: Pt = [(zone.x0 + zone.x1) / 2, zone.tableY - 20]
  const photoPxPerMm = localScale(planeHomography, centre)
  const pxPerMm = Math.min(14, Math.max(4, photoPxPerMm))
  const y1 = zone.tableY + MARGIN_BELOW_TABLE_MM
  const strip = rectify(cv, img, planeHomography, cal.distortion, shade, {
    x0: zone.x0, x1: zone.x1, y0: zone.top, y1, pxPerMm, cardHomography: cal.homography, tableY: zone.tableY,
  })
  const tableV = (zone.tableY - zone.top) * pxPerMm
  const sil = segmentBlade(cv, strip, tableV)
  if (!sil) throw new EngineRefusal('BLADE_NOT_FOUND', 'no runner stands out from the card')
  const samples = traceSamples(strip, sil, tableV)
  // Blur first: a defocused runner also loses stretches of its edge, and blur is what the person must fix.
  const blurMm = median(samples.map((s) => s.sigma)) / pxPerMm
  if (blurMm > MAX_BLUR_MM || blurMm * photoPxPerMm > MAX_BLUR_PX)
    throw new EngineRefusal('TOO_BLURRY', `edge blur ${blurMm.toFixed(2)} mm, ${(blurMm * photoPxPerMm).toFixed(1)} px`)
  const xs = samples.map((s) => s.p[0] / pxPerMm)
  if (samples.length < 100 || Math.max(...xs) - Math.min(...xs) < 150) throw new EngineRefusal('BLADE_NOT_FOUND', 'edge too short', SURFACE_ADVICE)
  // A jump of three photo pixels still joins a run: at 3 MP a dropped tooth tip leaves about that much.
  const jumpMm = Math.max(0.8, 3 / photoPxPerMm)
  const traced = dropStrayRuns(dropOutliers(samples.map((s) => stripToCard(strip, s.p[0], s.p[1])), 0.5, 0.03), jumpMm, 1.5)
  if (longestGapMm(traced) > MAX_EDGE_GAP_MM) throw new EngineRefusal('BLADE_NOT_FOUND', 'runner not told apart from the table', SURFACE_ADVICE)
  const toe = teethNear(traced, true, 45, 25, 0.5) >= teethNear(traced, false, 45, 25, 0.5) ? 'left' : 'right'
  const ordered = toe === 'left' ? traced : traced.reverse()
  const restored = restoreTips(startAtFirstTip(ordered, 0.5, TOE_PICK_ZONE_MM), { zoneMm: TOE_PICK_ZONE_MM })
  const edge = refineToothTips(strip, restored, TOE_PICK_ZONE_MM, blurMm * pxPerMm)
  return {
    edgeMm: edge,
    toe, planeHomography, blurMm, blurPx: blurMm * photoPxPerMm, edgeScatterMm: edgeScatterMm(edge),
    edgeSigmaMm: Math.max(edgeScatterMm(edge), SYSTEMATIC_EDGE_PX / photoPxPerMm),
    coverage: samples.length / Math.max(1, Math.round(pathLengthMm(edge) / 0.25)),
    darkerSteel: sil.darker, pxPerMm,
  }
}

/** A gap this long in the traced edge means part of the runner could not be told apart from what is behind it, mm. */
const MAX_EDGE_GAP_MM = 45

function longestGapMm(edge: Pt[]): number {
  let gap = 0
  for (let i = 1; i < edge.length; i++) gap = Math.max(gap, Math.hypot(edge[i][0] - edge[i - 1][0], edge[i][1] - edge[i - 1][1]))
  return gap
}

function pathLengthMm(edge: Pt[]): number {
  let s = 0
  for (let i = 1; i < edge.length; i++) s += Math.hypot(edge[i][0] - edge[i - 1][0], edge[i][1] - edge[i - 1][1])
  return s
}
