import type { Cv } from './opencv'
import { withMats } from './opencv'
import type { Strip } from './rectify'

type Pt = [number, number]

/** The blade's silhouette in a rectified strip: its outline (strip px) and whether steel is darker than the card. */
export interface Silhouette {
  outline: Pt[]
  darker: boolean
  threshold: number
  steelLevel: number
  cardLevel: number
  /** Whether the silhouette touches the strip's left or right end, or pixels that fall outside the photo. */
  touchesLeft: boolean
  touchesRight: boolean
  touchesPhotoBorder: boolean
}

function median(values: number[]): number {
  if (values.length === 0) return NaN
  const s = [...values].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

/** Card brightness from the strip's outer columns just above the table, where no blade should stand. */
function cardLevel(strip: Strip, tableV: number): number {
  const { width, data } = strip.img
  const band = Math.max(2, Math.round(0.06 * width))
  const values: number[] = []
  const v0 = Math.max(0, Math.round(tableV - 3 * strip.pxPerMm))
  const v1 = Math.max(v0 + 1, Math.round(tableV - 0.7 * strip.pxPerMm))
  for (let v = v0; v < v1; v++) {
    for (let u = 0; u < band; u++) values.push(data[v * width + u], data[v * width + width - 1 - u])
  }
  return median(values)
}

/** Otsu threshold over the strip's rows above the table line. */
function otsu(cv: Cv, strip: Strip, rows: number): number {
  return withMats((track) => {
    const src = track(new cv.Mat(rows, strip.img.width, cv.CV_8UC1))
    src.data.set(strip.img.data.subarray(0, rows * strip.img.width))
    const dst = track(new cv.Mat())
    return cv.threshold(src, dst, 0, 255, cv.THRESH_BINARY + cv.THRESH_OTSU) as number
  })
}

function classMeans(strip: Strip, rows: number, t: number): [number, number] {
  let lo = 0
  let nlo = 0
  let hi = 0
  let nhi = 0
  const d = strip.img.data
  for (let i = 0; i < rows * strip.img.width; i++) {
    if (d[i] > t) {
      hi += d[i]
      nhi++
    } else {
      lo += d[i]
      nlo++
    }
  }
  return [nlo ? lo / nlo : 0, nhi ? hi / nhi : 255]
}

/** Largest outer contour of a binary mask (CHAIN_APPROX_NONE), in mask px. */
function largestContour(cv: Cv, mask: Uint8Array, width: number, height: number): Pt[] {
  return withMats((track) => {
    const m = track(new cv.Mat(height, width, cv.CV_8UC1))
    m.data.set(mask)
    const kernel = track(cv.getStructuringElement(cv.MORPH_RECT, new cv.Size(3, 3)))
    cv.morphologyEx(m, m, cv.MORPH_OPEN, kernel)
    const contours = track(new cv.MatVector())
    const hierarchy = track(new cv.Mat())
    cv.findContours(m, contours, hierarchy, cv.RETR_EXTERNAL, cv.CHAIN_APPROX_NONE)
    let best: Pt[] = []
    let bestArea = 0
    for (let i = 0; i < contours.size(); i++) {
      const c = contours.get(i)
      const area = cv.contourArea(c)
      if (area > bestArea) {
        bestArea = area
        best = []
        for (let k = 0; k < c.rows; k++) best.push([c.data32S[2 * k], c.data32S[2 * k + 1]])
      }
      c.delete()
    }
    return best
  })
}

/**
 * Separates steel from card above the table line: Otsu's threshold, with the steel taken as the class farther from
 * the card's own brightness (so lighter and darker steel both work), then the largest connected region.
 */
export function segmentBlade(cv: Cv, strip: Strip, tableV: number): Silhouette | null {
  const { width, height, data } = strip.img
  const rows = Math.min(height, Math.max(2, Math.floor(tableV)))
  const t = otsu(cv, strip, rows)
  const [lo, hi] = classMeans(strip, rows, t)
  const card = cardLevel(strip, tableV)
  const darker = Math.abs(lo - card) > Math.abs(hi - card)
  const mask = new Uint8Array(width * height)
  for (let i = 0; i < rows * width; i++) if (darker ? data[i] <= t : data[i] > t) mask[i] = 255
  const outline = largestContour(cv, mask, width, height)
  if (outline.length < 20) return null
  const margin = 2
  let touchesLeft = false
  let touchesRight = false
  let touchesPhotoBorder = false
  for (const [u, v] of outline) {
    if (u <= margin) touchesLeft = true
    if (u >= width - 1 - margin) touchesRight = true
    if (!strip.inside[v * width + u]) touchesPhotoBorder = true
  }
  return {
    outline, darker, threshold: t, steelLevel: darker ? lo : hi, cardLevel: card,
    touchesLeft, touchesRight, touchesPhotoBorder,
  }
}
