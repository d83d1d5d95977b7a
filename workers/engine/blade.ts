import type { Cv } from './opencv'
import type { GreyImage } from './image'
import type { Calibration } from './calibrate'
import { offsetPlaneHomography } from './camera'
import { localScale, rectify, stripToCard, type Strip } from './rectify'
import { segmentBlade, type Silhouette } from './segment'
import { lowerPath, refineAlongNormals, smoothResample, type EdgeSample } from './trace'
import { EngineRefusal } from './errors'
import type { Mat3, Pt } from './projective'

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
  edgeSigmaMm: number
  /** Share of the traced outline that gave a clean sub-pixel edge. */
  coverage: number
  darkerSteel: boolean
  pxPerMm: number
}

const MARGIN_BELOW_TABLE_MM = 4

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b)
  return s.length ? s[Math.floor(s.length / 2)] : NaN
}

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

/** Area between the edge and its lower convex hull over one end quarter: the toe picks leave gaps, the heel none. */
function hullGapArea(edge: Pt[], fromLeft: boolean): number {
  const xs = edge.map((p) => p[0])
  const minX = Math.min(...xs)
  const maxX = Math.max(...xs)
  const limit = fromLeft ? minX + 0.25 * (maxX - minX) : maxX - 0.25 * (maxX - minX)
  const part = edge.filter((p) => (fromLeft ? p[0] <= limit : p[0] >= limit)).sort((a, b) => a[0] - b[0])
  // Lower hull in card mm (y down): the hull runs along the largest y.
  const hull: Pt[] = []
  for (const p of part) {
    while (hull.length >= 2) {
      const [a, b] = [hull[hull.length - 2], hull[hull.length - 1]]
      if ((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]) >= 0) hull.pop()
      else break
    }
    hull.push(p)
  }
  let area = 0
  for (let i = 1; i < part.length; i++) {
    const x = part[i][0]
    let k = 1
    while (k < hull.length - 1 && hull[k][0] < x) k++
    const [a, b] = [hull[k - 1], hull[k]]
    const hy = b[0] === a[0] ? a[1] : a[1] + ((b[1] - a[1]) * (x - a[0])) / (b[0] - a[0])
    area += Math.max(0, hy - part[i][1]) * (part[i][0] - part[i - 1][0])
  }
  return area
}

function checkCutOff(sil: Silhouette, path: Pt[], strip: Strip): void {
  if (sil.touchesLeft || sil.touchesRight) throw new EngineRefusal('BLADE_CUT_OFF', 'silhouette reaches the zone end')
  const w = strip.img.width
  for (const [u, v] of path) {
    for (const [du, dv] of [[-2, 0], [2, 0], [0, 2], [0, -2]]) {
      const uu = u + du
      const vv = v + dv
      if (uu >= 0 && uu < w && vv >= 0 && vv < strip.img.height && !strip.inside[vv * w + uu])
        throw new EngineRefusal('BLADE_CUT_OFF', 'edge reaches the photo border')
    }
  }
}

function traceSamples(strip: Strip, sil: Silhouette): EdgeSample[] {
  const r = strip.pxPerMm
  const path = lowerPath(sil.outline).filter(([, v]) => v > 1.5 * r)
  checkCutOff(sil, path, strip)
  const coarse = smoothResample(path, Math.max(2, Math.round(0.6 * r)), 0.25 * r)
  return refineAlongNormals(strip, coarse, sil, Math.max(3, 0.9 * r))
}

/**
 * Finds the runner in the card's blade zone and traces its bottom edge with sub-pixel accuracy, on the plane
 * `offsetMm` in front of the card (where the runner's near face stands).
 */
export function traceBlade(cv: Cv, img: GreyImage, cal: Calibration, zone: BladeZone, offsetMm: number): BladeEdge {
  const planeHomography = offsetPlaneHomography(cal.pose, cal.distortion, -offsetMm)
  const centre: Pt = [(zone.x0 + zone.x1) / 2, zone.tableY - 20]
  const photoPxPerMm = localScale(planeHomography, centre)
  const pxPerMm = Math.min(14, Math.max(4, photoPxPerMm))
  const y1 = zone.tableY + MARGIN_BELOW_TABLE_MM
  const strip = rectify(cv, img, planeHomography, cal.distortion, { x0: zone.x0, x1: zone.x1, y0: zone.top, y1, pxPerMm })
  const tableV = (zone.tableY - zone.top) * pxPerMm
  const sil = segmentBlade(cv, strip, tableV)
  if (!sil || Math.abs(sil.steelLevel - sil.cardLevel) < 12) throw new EngineRefusal('BLADE_NOT_FOUND')
  const samples = traceSamples(strip, sil)
  const xs = samples.map((s) => s.p[0] / pxPerMm)
  if (samples.length < 100 || Math.max(...xs) - Math.min(...xs) < 150) throw new EngineRefusal('BLADE_NOT_FOUND')
  const edge = samples.map((s) => stripToCard(strip, s.p[0], s.p[1]))
  const toe = hullGapArea(edge, true) >= hullGapArea(edge, false) ? 'left' : 'right'
  const blurMm = median(samples.map((s) => s.sigma)) / pxPerMm
  return {
    edgeMm: toe === 'left' ? edge : edge.reverse(),
    toe, planeHomography, blurMm, blurPx: blurMm * photoPxPerMm, edgeSigmaMm: edgeScatterMm(edge),
    coverage: samples.length / Math.max(1, Math.round(pathLengthMm(edge) / 0.25)),
    darkerSteel: sil.darker, pxPerMm,
  }
}

function pathLengthMm(edge: Pt[]): number {
  let s = 0
  for (let i = 1; i < edge.length; i++) s += Math.hypot(edge[i][0] - edge[i - 1][0], edge[i][1] - edge[i - 1][1])
  return s
}
