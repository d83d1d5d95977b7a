import type { Cv } from './opencv'
import { withMats } from './opencv'
import type { GreyImage } from './image'
import { localScale as homographyScale } from '../../shared/geometry/homography'
import { apply, invert, toRows, type Mat3, type Pt } from './projective'
import { distort, type Distortion } from './camera'
import type { CardShade } from './shade'

/**
 * A rectified view of a rectangle of the runner's plane: pixel (u, v) shows card-frame point
 * (x0 + u / pxPerMm, y0 + v / pxPerMm), resampled from the photo through the offset-plane homography and the lens
 * model. `inside` is 0 where the source falls outside the photo, 1 where the ray would meet the card behind the
 * runner, and 2 where it passes below the card's bottom edge onto the table.
 */
export interface Strip {
  img: GreyImage
  inside: Uint8Array
  /** Expected brightness of blank card at each pixel (the card's shading carried into the strip). */
  shade: Float32Array
  /**
   * How far below the card's bottom edge the ray through each pixel meets the card plane, strip px (negative where it
   * meets the card): its zero line is where the table starts to show behind the runner, known from the calibration.
   */
  tableDepth: Float32Array
  x0: number
  y0: number
  pxPerMm: number
}

export function stripToCard(s: Strip, u: number, v: number): Pt {
  return [s.x0 + u / s.pxPerMm, s.y0 + v / s.pxPerMm]
}

export function cardToStrip(s: Strip, p: Pt): Pt {
  return [(p[0] - s.x0) * s.pxPerMm, (p[1] - s.y0) * s.pxPerMm]
}

/** Photo px per card mm at a card point (the homography's local scale), for choosing a resampling density. */
export function localScale(h: Mat3, p: Pt): number {
  return homographyScale(toRows(h), p)
}

export interface StripRequest {
  x0: number
  y0: number
  x1: number
  y1: number
  pxPerMm: number
  /** Card plane (z = 0) mm → undistorted px, and the card's bottom edge (the table line), card mm. */
  cardHomography: Mat3
  tableY: number
}

/** Strip pixels between exact evaluations of the resampling maps along a row (see rectify). */
const MAP_STEP = 8

export const BEHIND_CARD = 1
export const BEHIND_TABLE = 2

/** Resamples the photo onto a rectangle of the plane `hPlane` (card mm → undistorted px) describes. */
export function rectify(cv: Cv, photo: GreyImage, hPlane: Mat3, d: Distortion, shadeAt: CardShade, req: StripRequest): Strip {
  const w = Math.max(2, Math.round((req.x1 - req.x0) * req.pxPerMm))
  const h = Math.max(2, Math.round((req.y1 - req.y0) * req.pxPerMm))
  const inside = new Uint8Array(w * h)
  const shade = new Float32Array(w * h)
  const tableDepth = new Float32Array(w * h)
  const toCard = invert(req.cardHomography)
  const out = withMats((track) => {
    const src = track(new cv.Mat(photo.height, photo.width, cv.CV_8UC1))
    src.data.set(photo.data)
    const mapX = track(new cv.Mat(h, w, cv.CV_32FC1))
    const mapY = track(new cv.Mat(h, w, cv.CV_32FC1))
    const mx = mapX.data32F as Float32Array
    const my = mapY.data32F as Float32Array
    // The maps are smooth (a homography and the lens model), so they are computed exactly every MAP_STEP pixels along
    // each row and interpolated linearly between: the interpolation error is well under a thousandth of a pixel, and
    // a strip has millions of pixels.
    const nodes = Math.ceil((w - 1) / MAP_STEP) + 1
    const nx = new Float64Array(nodes)
    const ny = new Float64Array(nodes)
    const ns = new Float64Array(nodes)
    const nd = new Float64Array(nodes)
    for (let v = 0; v < h; v++) {
      const y = req.y0 + v / req.pxPerMm
      for (let j = 0; j < nodes; j++) {
        const und = apply(hPlane, [req.x0 + Math.min(j * MAP_STEP, w - 1) / req.pxPerMm, y])
        const q = distort(d, und)
        nx[j] = q[0]
        ny[j] = q[1]
        ns[j] = shadeAt(q[0], q[1])
        nd[j] = (apply(toCard, und)[1] - req.tableY) * req.pxPerMm
      }
      // Segment by segment between nodes (the last takes the row's remainder), so no pixel searches for its nodes.
      for (let j = 0; j < nodes - 1; j++) {
        const u0 = j * MAP_STEP
        const uEnd = j === nodes - 2 ? w : u0 + MAP_STEP
        const span = Math.min(u0 + MAP_STEP, w - 1) - u0 || 1
        const x0 = nx[j]
        const dx = nx[j + 1] - x0
        const y0 = ny[j]
        const dy = ny[j + 1] - y0
        const s0 = ns[j]
        const ds = ns[j + 1] - s0
        const d0 = nd[j]
        const dd = nd[j + 1] - d0
        for (let u = u0; u < uEnd; u++) {
          const t = (u - u0) / span
          const i = v * w + u
          const qx = x0 + t * dx
          const qy = y0 + t * dy
          mx[i] = qx
          my[i] = qy
          shade[i] = s0 + t * ds
          tableDepth[i] = d0 + t * dd
          const inPhoto = qx >= 1 && qy >= 1 && qx <= photo.width - 2 && qy <= photo.height - 2
          inside[i] = !inPhoto ? 0 : tableDepth[i] > 0 ? BEHIND_TABLE : BEHIND_CARD
        }
      }
    }
    const dst = track(new cv.Mat())
    cv.remap(src, dst, mapX, mapY, cv.INTER_LINEAR, cv.BORDER_REPLICATE)
    return new Uint8Array(dst.data)
  })
  return { img: { data: out, width: w, height: h }, inside, shade, tableDepth, x0: req.x0, y0: req.y0, pxPerMm: req.pxPerMm }
}
