import type { GreyImage } from './image'
import type { DetectedMarker } from './markers'
import { refineMarkerCorners } from './subpixel'
import { invert, rmsResidual, type Mat3, type Pt } from './projective'
import { noDistortion, planePose, undistort, type Distortion, type PlanePose } from './camera'
import { fitHomography } from './homography'
import { EngineRefusal } from './errors'

/** The parts of a card layout calibration needs (card-frame mm: origin top-left, x right, y down). */
export interface CardMarkers {
  paper: string
  widthMm: number
  heightMm: number
  markers: { id: number; cornersMm: Pt[] }[]
}

export interface Calibration {
  paper: string
  /** Card mm → undistorted photo px, fitted on the card plane. */
  homography: Mat3
  distortion: Distortion
  pose: PlanePose
  residualPx: number
  residualMm: number
  markerIds: number[]
  /** Marker corner correspondences kept for the fit. */
  cardPts: Pt[]
  photoPts: Pt[]
}

interface Matched {
  paper: CardMarkers
  card: Pt[]
  photo: Pt[]
  ids: number[]
}

function match(layout: CardMarkers, found: { id: number; corners: Pt[] }[]): Matched {
  const card: Pt[] = []
  const photo: Pt[] = []
  const ids: number[] = []
  for (const m of found) {
    const known = layout.markers.find((k) => k.id === m.id)
    if (!known) continue
    ids.push(m.id)
    for (let i = 0; i < 4; i++) {
      card.push(known.cornersMm[i])
      photo.push(m.corners[i])
    }
  }
  return { paper: layout, card, photo, ids }
}

/** Drops markers whose corners disagree with the others (a misread id or a marker off the card). */
function rejectOutlierMarkers(m: Matched): Matched {
  let current = m
  for (let pass = 0; pass < 3 && current.ids.length > 4; pass++) {
    const h = fitHomography(current.card, current.photo)
    const perMarker = current.ids.map((_, i) =>
      rmsResidual(h, current.card.slice(4 * i, 4 * i + 4), current.photo.slice(4 * i, 4 * i + 4)),
    )
    const sorted = [...perMarker].sort((a, b) => a - b)
    const limit = Math.max(3, 5 * sorted[Math.floor(sorted.length / 2)])
    const worst = perMarker.indexOf(sorted[sorted.length - 1])
    if (perMarker[worst] <= limit) break
    const keep = (_: unknown, i: number) => Math.floor(i / 4) !== worst
    current = { ...current, card: current.card.filter(keep), photo: current.photo.filter(keep), ids: current.ids.filter((_, i) => i !== worst) }
  }
  return current
}

function residualFor(k: number, base: Distortion, m: Matched): number {
  const d = { ...base, k }
  const und = m.photo.map((p) => undistort(d, p))
  return rmsResidual(fitHomography(m.card, und), m.card, und)
}

/** Division-model coefficient minimising the marker-corner residual (golden-section search). */
function estimateDistortion(base: Distortion, m: Matched): Distortion {
  let lo = -0.3
  let hi = 0.3
  const g = (Math.sqrt(5) - 1) / 2
  let a = hi - g * (hi - lo)
  let b = lo + g * (hi - lo)
  let fa = residualFor(a, base, m)
  let fb = residualFor(b, base, m)
  for (let it = 0; it < 30; it++) {
    if (fa < fb) {
      hi = b
      b = a
      fb = fa
      a = hi - g * (hi - lo)
      fa = residualFor(a, base, m)
    } else {
      lo = a
      a = b
      fa = fb
      b = lo + g * (hi - lo)
      fb = residualFor(b, base, m)
    }
  }
  const k = (lo + hi) / 2
  // Keep the lens model only when it explains the corners clearly better than no model.
  return residualFor(k, base, m) < 0.9 * residualFor(0, base, m) ? { ...base, k } : base
}

function spansCard(m: Matched): boolean {
  const xs = m.card.map((p) => p[0])
  return m.ids.length >= 3 && Math.max(...xs) - Math.min(...xs) >= 0.6 * m.paper.widthMm
}

/** Finds the card, refines its marker corners, fits lens distortion, homography and camera pose. */
export function calibrate(img: GreyImage, detected: DetectedMarker[], scale: number, layouts: CardMarkers[]): Calibration {
  const window = Math.max(4, 2.5 / scale)
  const refined = detected
    .map((m) => ({ id: m.id, corners: refineMarkerCorners(img, m, window) }))
    .filter((m): m is { id: number; corners: Pt[] } => m.corners !== null)
  const matched = layouts.map((l) => rejectOutlierMarkers(match(l, refined)))
  const candidates = matched.filter(spansCard)
  if (candidates.length === 0) {
    // Markers of one end only: the photo shows part of the card, so the blade runs out of it too.
    if (matched.some((m) => m.ids.length >= 3)) throw new EngineRefusal('BLADE_CUT_OFF', 'markers of one end only')
    throw new EngineRefusal('CARD_NOT_FOUND', `${detected.length} markers detected, ${refined.length} refined`)
  }
  const scored = candidates.map((m) => ({ m, r: rmsResidual(fitHomography(m.card, m.photo), m.card, m.photo) }))
  scored.sort((x, y) => y.m.ids.length - x.m.ids.length || x.r - y.r)
  const best = scored[0].m
  const distortion = estimateDistortion(noDistortion(img.width, img.height), best)
  const und = best.photo.map((p) => undistort(distortion, p))
  const homography = fitHomography(best.card, und)
  const inv = invert(homography)
  const residualPx = rmsResidual(homography, best.card, und)
  const residualMm = rmsResidual(inv, und, best.card)
  const pose = planePose(homography, distortion, img.width, img.height)
  return {
    paper: best.paper.paper, homography, distortion, pose, residualPx, residualMm, markerIds: best.ids,
    cardPts: best.card, photoPts: best.photo,
  }
}

