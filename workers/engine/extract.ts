import { cardLayout, type CardLayout } from '../../shared/card/layout'
import { getCv, withMats, type Cv, type Mat } from './opencv'
import { decodeGrey, type GreyImage } from './image'
import { DETECT_MAX_SIDE, detectMarkers, reduce, toMat } from './markers'
import { calibrate, type CardMarkers, type Calibration } from './calibrate'
import { traceBlade, type BladeEdge } from './blade'
import { fitCardShade } from './shade'
import { distort } from './camera'
import { fitHomography } from './homography'
import { apply, type Mat3, type Pt } from './projective'
import { EngineRefusal, type RefusalCode } from './errors'
import { findTopEdge } from './top-edge'
import type { TopEdge } from '../../shared/schemas/analysis'

/** Nominal distance of the runner's near face in front of the card: half a 4 mm runner (DESIGN §3). */
export const RUNNER_OFFSET_MM = 2
/**
 * Whole-photo sharpness: standard deviation of the Laplacian of the photo reduced to 700 px, over the photo's own
 * standard deviation. Reducing that far averages the sensor noise away (at 1000 px a noisy defocused 3 MP photo could
 * score as high as a sharp one) while a defocus of several pixels survives it. Measured on generated photos at 12 MP
 * and 3 MP (28 usable, 28 strongly defocused): 0.75–1.42 for usable ones, 0.18–0.51 for strongly defocused ones.
 */
const MIN_PHOTO_SHARPNESS = 0.62
const SHARPNESS_SIDE_PX = 700

function photoSharpness(cv: Cv, full: Mat): number {
  return withMats((track) => {
    const { mat } = reduce(cv, full, SHARPNESS_SIDE_PX)
    track(mat)
    const lap = track(new cv.Mat())
    cv.Laplacian(mat, lap, cv.CV_32F, 3)
    const [m1, s1, m2, s2] = [track(new cv.Mat()), track(new cv.Mat()), track(new cv.Mat()), track(new cv.Mat())]
    cv.meanStdDev(lap, m1, s1)
    cv.meanStdDev(mat, m2, s2)
    return s1.data64F[0] / Math.max(1, s2.data64F[0])
  })
}

/**
 * Square candidates the marker detector rejected, from which a card is taken to be in the photo but unreadable:
 * measured on synthetic photos, 16–17 for a defocused card, 0–1 for a photo with no card.
 */
const BLURRED_CARD_SQUARES = 8

/**
 * Runs `find`, but says TOO_BLURRY rather than "not found" when the whole photo is out of focus and something is
 * there to be found (`present`): a photo without a card is as smooth as a defocused one. A defocused card can also lose
 * one end's markers, which would otherwise read as a blade cut off by the frame.
 */
/** Refusals a defocused photo can produce in place of TOO_BLURRY. */
const BLUR_CAN_CAUSE = new Set<RefusalCode>(['CARD_NOT_FOUND', 'BLADE_NOT_FOUND', 'BLADE_CUT_OFF'])

function orExplainBlur<T>(cv: Cv, full: Mat, present: boolean, find: () => T): T {
  try {
    return find()
  } catch (err) {
    const maybeBlur = present && err instanceof EngineRefusal && BLUR_CAN_CAUSE.has(err.code)
    if (maybeBlur && photoSharpness(cv, full) < MIN_PHOTO_SHARPNESS) throw new EngineRefusal('TOO_BLURRY', 'photo out of focus')
    throw err
  }
}

/** Card residual beyond which the card is bent, misprinted or misdetected, mm. */
export const MAX_CARD_RESIDUAL_MM = 0.6

export interface ExtractedEdge {
  edge: BladeEdge
  calibration: Calibration
  layout: CardLayout
  /** Card mm → photo px (distorted), fitted along the traced edge so an overlay drawn with it lands on the edge. */
  overlayHomography: Mat3
  /** Physical mm per printed card mm, from the check-bar reading (1 when none was entered). */
  printScale: number
  image: { width: number; height: number }
  /** The runner's top edge where it shows (top-edge.ts), card mm; null when it does not. */
  topEdge: TopEdge | null
}

/** A card layout scaled to the physical size the person's check-bar reading implies. */
function scaledMarkers(layout: CardLayout, printScale: number): CardMarkers {
  return {
    paper: layout.paper,
    widthMm: layout.widthMm * printScale,
    heightMm: layout.heightMm * printScale,
    markers: layout.markers.map((m) => ({ id: m.id, cornersMm: m.cornersMm.map(([x, y]) => [x * printScale, y * printScale] as Pt) })),
  }
}

/**
 * Card mm → photo px for drawing the overlay: a homography fitted, by least squares, to the runner-plane mapping with
 * lens distortion over a grid around the traced edge, so the stored 3×3 matrix lands on the edge in the photo.
 */
function overlayHomography(edge: BladeEdge, cal: Calibration): Mat3 {
  const xs = edge.edgeMm.map((p) => p[0])
  const ys = edge.edgeMm.map((p) => p[1])
  const [x0, x1] = [Math.min(...xs), Math.max(...xs)]
  const [y0, y1] = [Math.min(...ys) - 10, Math.max(...ys) + 5]
  const card: Pt[] = []
  for (let i = 0; i <= 12; i++) for (let j = 0; j <= 4; j++) card.push([x0 + ((x1 - x0) * i) / 12, y0 + ((y1 - y0) * j) / 4])
  const photo = card.map((p) => distort(cal.distortion, apply(edge.planeHomography, p)))
  return fitHomography(card, photo)
}

async function locate(img: GreyImage, layouts: CardLayout[], printScale: number) {
  const cv = await getCv()
  return withMats((track) => {
    const full = track(toMat(cv, img))
    const reduced = reduce(cv, full, DETECT_MAX_SIDE)
    track(reduced.mat)
    const markers = layouts.map((l) => scaledMarkers(l, printScale))
    const detection = detectMarkers(cv, reduced.mat, reduced.scale)
    const calibration = orExplainBlur(cv, full, detection.rejected >= BLURRED_CARD_SQUARES, () =>
      calibrate(img, detection.markers, reduced.scale, markers),
    )
    if (calibration.residualMm > MAX_CARD_RESIDUAL_MM)
      throw new EngineRefusal('CARD_NOT_FOUND', `card residual ${calibration.residualMm.toFixed(2)} mm`)
    const layout = layouts.find((l) => l.paper === calibration.paper) as CardLayout
    const z = layout.bladeZone
    const zone = {
      x0: z.xMm * printScale, x1: (z.xMm + z.widthMm) * printScale,
      top: z.yMm * printScale, tableY: layout.heightMm * printScale,
    }
    const shade = fitCardShade(img, calibration, scaledMarkers(layout, printScale))
    const edge = orExplainBlur(cv, full, true, () => traceBlade(cv, img, calibration, zone, RUNNER_OFFSET_MM, shade))
    const top = findTopEdge(cv, img, calibration, edge, shade, zone.tableY)
    return { calibration, layout, edge, topEdge: top && { cardMm: top.stretchesMm, sigmaMm: top.sigmaMm } }
  })
}

/** Decodes a photo, finds the card and traces the blade's bottom edge in card mm, or throws an EngineRefusal. */
export async function extractEdge(bytes: Buffer, checkBarMm?: number | null): Promise<ExtractedEdge> {
  const printScale = checkBarMm ? checkBarMm / 100 : 1
  const img = await decodeGrey(bytes)
  const { calibration, layout, edge, topEdge } = await locate(img, [cardLayout('a4'), cardLayout('letter')], printScale)
  return {
    edge, calibration, layout, overlayHomography: overlayHomography(edge, calibration), printScale,
    image: { width: img.width, height: img.height }, topEdge,
  }
}
