import type { Cv } from './opencv'
import { withMats } from './opencv'
import { BEHIND_CARD, BEHIND_TABLE, type Strip } from './rectify'

type Pt = [number, number]

/**
 * What differs from blank card above the table line in a rectified strip — runner, boot and their shadows — as the
 * outline of its largest connected region (strip px), and the steel's brightness relative to the card.
 */
export interface Silhouette {
  outline: Pt[]
  /** Median brightness of the steel over the card's expected brightness there (< 1: darker steel). */
  steelRatio: number
  darker: boolean
}

/** First pass: a pixel is foreground when its brightness differs from the card's expected brightness by this share. */
const FIRST_PASS_CONTRAST = 0.07

/**
 * Largest outer contour of a binary mask (CHAIN_APPROX_NONE), after a 3 × 3 opening against noise. An opening also
 * cuts a sharp tooth's last few pixels off, which the edge search cannot then recover, so with `restoreTips` the
 * mask's own pixels within 3 px of the opened mask are put back (an opening by partial reconstruction).
 */
export function largestContour(cv: Cv, mask: Uint8Array, width: number, height: number, restoreTips = false): Pt[] {
  return withMats((track) => {
    const m = track(new cv.Mat(height, width, cv.CV_8UC1))
    m.data.set(mask)
    const kernel = track(cv.getStructuringElement(cv.MORPH_RECT, new cv.Size(3, 3)))
    if (restoreTips) {
      const original = track(m.clone())
      cv.morphologyEx(m, m, cv.MORPH_OPEN, kernel)
      const near = track(cv.getStructuringElement(cv.MORPH_ELLIPSE, new cv.Size(7, 7)))
      cv.dilate(m, m, near)
      cv.bitwise_and(m, original, m)
    } else cv.morphologyEx(m, m, cv.MORPH_OPEN, kernel)
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

/** The strip smoothed by a Gaussian of `sigmaPx`, so speckle and fine texture do not break the mask. */
export function smoothed(cv: Cv, strip: Strip, sigmaPx: number): Uint8Array {
  return withMats((track) => {
    const src = track(new cv.Mat(strip.img.height, strip.img.width, cv.CV_8UC1))
    src.data.set(strip.img.data)
    const dst = track(new cv.Mat())
    cv.GaussianBlur(src, dst, new cv.Size(0, 0), sigmaPx)
    return new Uint8Array(dst.data)
  })
}

/**
 * Mask of pixels whose brightness over the card's expected brightness is beyond `threshold` from 1 — on either side
 * (polarity 0) or only on the steel's side (+1 lighter, −1 darker) — where the card is behind; and, where the table
 * is behind (below the card's bottom edge), of pixels off the table's own brightness by `tableStep` grey levels.
 */
export function ratioMask(strip: Strip, data: Uint8Array, threshold: number, polarity: -1 | 0 | 1, table?: { level: Float32Array; step: number }): Uint8Array {
  const { width, height } = strip.img
  const mask = new Uint8Array(width * height)
  for (let i = 0; i < width * height; i++) {
    if (strip.inside[i] === BEHIND_CARD) {
      const d = data[i] / strip.shade[i] - 1
      if (polarity === 0 ? Math.abs(d) > threshold : polarity * d > threshold) mask[i] = 255
    } else if (strip.inside[i] === BEHIND_TABLE && table) {
      if (Math.abs(data[i] - table.level[i % width]) > table.step) mask[i] = 255
    }
  }
  return mask
}

/** The table's brightness in each column: median of the strip's bottom rows over a block of columns either side. */
export function tableLevels(strip: Strip, data: Uint8Array, rows: number): Float32Array {
  const { width, height } = strip.img
  const half = Math.round(3 * strip.pxPerMm)
  const perColumn = new Float32Array(width)
  for (let u = 0; u < width; u++) {
    const values: number[] = []
    for (let v = height - rows; v < height; v++) values.push(data[v * width + u])
    values.sort((a, b) => a - b)
    perColumn[u] = values[Math.floor(values.length / 2)]
  }
  const out = new Float32Array(width)
  for (let u = 0; u < width; u++) {
    const block = Array.from(perColumn.subarray(Math.max(0, u - half), Math.min(width, u + half + 1))).sort((a, b) => a - b)
    out[u] = block[Math.floor(block.length / 2)]
  }
  return out
}

/** Columns where an outline comes within `nearPx` of the table line: the runner rests on the table, the boot does not. */
function tableColumns(outline: Pt[], tableV: number, nearPx: number): number[] {
  const cols = new Set<number>()
  for (const [u, v] of outline) if (v >= tableV - nearPx) cols.add(u)
  return [...cols]
}

/** Median brightness ratio of masked pixels 1–4 mm above the table line in the given columns: steel resting there. */
function ratioNearTable(strip: Strip, data: Uint8Array, mask: Uint8Array, tableV: number, cols: number[]): number {
  const r = strip.pxPerMm
  const values: number[] = []
  for (const u of cols) {
    for (let v = Math.floor(tableV - 4 * r); v <= tableV - r; v++) {
      const i = v * strip.img.width + u
      if (v >= 0 && mask[i]) values.push(data[i] / strip.shade[i])
    }
  }
  values.sort((a, b) => a - b)
  return values.length ? values[Math.floor(values.length / 2)] : 1
}

/**
 * Finds the runner: of the regions lighter and darker than the card, the steel is the one resting on the table over
 * the longest stretch; its brightness there sets a second threshold half-way between card and steel, which outlines
 * the runner without the boot and most shadows. Returns null when nothing rests on the table.
 */
export function segmentBlade(cv: Cv, strip: Strip, tableV: number): Silhouette | null {
  const { width, height } = strip.img
  const r = strip.pxPerMm
  const data = smoothed(cv, strip, Math.max(1, 0.3 * r))
  let best: { polarity: -1 | 1; cols: number[]; mask: Uint8Array } | null = null
  for (const polarity of [1, -1] as const) {
    const mask = ratioMask(strip, data, FIRST_PASS_CONTRAST, polarity)
    const cols = tableColumns(largestContour(cv, mask, width, height), tableV, 2.5 * r + 1)
    if (!best || cols.length > best.cols.length) best = { polarity, cols, mask }
  }
  if (!best || best.cols.length < 10 * r) return null
  const ratio = ratioNearTable(strip, data, best.mask, tableV, best.cols)
  if (Math.abs(ratio - 1) < 0.08) return null
  const table = { level: tableLevels(strip, data, Math.max(2, Math.round(0.8 * r))), step: Math.max(10, 0.5 * Math.abs(ratio - 1) * strip.shade[Math.floor(tableV - r) * width + (width >> 1)]) }
  const outline = largestContour(cv, ratioMask(strip, data, 0.5 * Math.abs(ratio - 1), best.polarity, table), width, height, true)
  return outline.length < 20 ? null : { outline, steelRatio: ratio, darker: ratio < 1 }
}
