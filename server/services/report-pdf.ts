import { createRequire } from 'node:module'
import PDFDocument from 'pdfkit'
import type { Vec2 } from '../../shared/geometry/vec'

/**
 * Small drawing vocabulary for our PDF reports (pdfkit): headings, paragraphs, key–value lines, simple tables and
 * a line chart in millimetres. Colours are the app's palette; status is written in words, never coloured.
 */

const FONT_DIR = createRequire(import.meta.url).resolve('@fontsource/ibm-plex-sans/package.json').replace(/package\.json$/, 'files/')
const FONTS = { regular: `${FONT_DIR}ibm-plex-sans-latin-400-normal.woff`, bold: `${FONT_DIR}ibm-plex-sans-latin-600-normal.woff` }
export const INK = '#1b2a41'
export const STEEL = '#4a5868'
export const STEEL_LIGHT = '#c3ccd6'
export const ACCENT = '#c8742a'
export const ACCENT_PALE = '#f6e3d0'
const MARGIN = 48

export type Doc = PDFKit.PDFDocument

/** A new A4 document and a promise of its bytes once `doc.end()` is called. */
export function newReport(title: string): { doc: Doc; bytes: Promise<Buffer> } {
  const doc = new PDFDocument({ size: 'A4', margin: MARGIN, info: { Title: title, Creator: 'Rockerbook' } })
  doc.registerFont('regular', FONTS.regular)
  doc.registerFont('bold', FONTS.bold)
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const bytes = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  doc.font('bold').fontSize(18).fillColor(INK).text(title)
  return { doc, bytes }
}

const width = (doc: Doc) => doc.page.width - 2 * MARGIN

function ensureRoom(doc: Doc, heightPt: number): void {
  if (doc.y + heightPt > doc.page.height - MARGIN) doc.addPage()
}

export function heading(doc: Doc, text: string): void {
  ensureRoom(doc, 60)
  doc.moveDown(0.8).font('bold').fontSize(13).fillColor(INK).text(text, MARGIN)
  doc.moveDown(0.2)
}

export function paragraph(doc: Doc, text: string, opts: { muted?: boolean; size?: number } = {}): void {
  doc.font('regular').fontSize(opts.size ?? 10).fillColor(opts.muted ? STEEL : INK).text(text, MARGIN, undefined, { width: width(doc) })
}

export function keyValues(doc: Doc, rows: [string, string][]): void {
  for (const [k, v] of rows) {
    ensureRoom(doc, 16)
    const y = doc.y
    doc.font('regular').fontSize(10).fillColor(STEEL).text(k, MARGIN, y, { width: 130 })
    doc.font('regular').fillColor(INK).text(v, MARGIN + 140, y, { width: width(doc) - 140 })
  }
}

/** A table with a bold header row; columns get the given share of the page width. */
export function table(doc: Doc, header: string[], rows: string[][], shares: number[]): void {
  const total = shares.reduce((a, b) => a + b, 0)
  const xs = shares.map((_, i) => MARGIN + (shares.slice(0, i).reduce((a, b) => a + b, 0) / total) * width(doc))
  const ws = shares.map((s) => (s / total) * width(doc) - 6)
  const line = (cells: string[], font: string) => {
    doc.font(font).fontSize(9)
    const h = Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: ws[i] })))
    ensureRoom(doc, h + 6)
    const y = doc.y
    cells.forEach((c, i) => doc.fillColor(font === 'bold' ? STEEL : INK).text(c, xs[i], y, { width: ws[i] }))
    doc.y = y + h + 3
    doc.moveTo(MARGIN, doc.y).lineTo(MARGIN + width(doc), doc.y).lineWidth(0.4).strokeColor(STEEL_LIGHT).stroke()
    doc.y += 3
  }
  line(header, 'bold')
  for (const r of rows) line(r, 'regular')
  doc.x = MARGIN
}

const CHART_HEADROOM_PT = 6

/**
 * The vertical exaggeration a chart uses: the one asked for when the heights fit, else the largest half step that
 * fits (`fits` is the exaggeration that fills the height exactly), and below 1 the exact fit.
 */
export function fittedExaggeration(wanted: number, fits: number): number {
  if (wanted <= fits) return wanted
  return fits >= 1 ? Math.floor(fits * 2) / 2 : fits
}

const formatFactor = (f: number) => (Number.isInteger(f) ? String(f) : f >= 1 ? f.toFixed(1) : f.toFixed(2))

export interface ChartSeries {
  points: readonly Vec2[]
  colour: string
  label: string
  dash?: boolean
}

/**
 * A line chart in mm: x to the page width, y scaled by `yExaggeration` relative to x (a rocker is only millimetres
 * deep over hundreds). Every point is drawn, never clipped: when the exaggerated heights (tall toe picks) would need
 * more than `heightPt`, the exaggeration is lowered until they fit, and the caption states the one used. `band`
 * shades an x interval in the pale accent (a target band); `marks` are labelled ticks at x positions.
 */
export function lineChart(doc: Doc, opts: {
  series: ChartSeries[]; heightPt: number; yExaggeration?: number; band?: [number, number]
  marks?: { x: number; label: string }[]; caption: string; yZeroLine?: boolean
}): void {
  const all = opts.series.flatMap((s) => s.points)
  if (!all.length) return
  const [x0, x1] = [Math.min(...all.map((p) => p[0])), Math.max(...all.map((p) => p[0]))]
  const [y0, y1] = [Math.min(0, ...all.map((p) => p[1])), Math.max(...all.map((p) => p[1]))]
  const sx = width(doc) / Math.max(x1 - x0, 1e-9)
  const exaggeration = opts.yExaggeration ? fittedExaggeration(opts.yExaggeration, opts.heightPt / (Math.max(y1 - y0, 1e-9) * sx)) : null
  const sy = exaggeration ? sx * exaggeration : opts.heightPt / Math.max(y1 - y0, 1e-9)
  const plotHeight = (y1 - y0) * sy
  ensureRoom(doc, plotHeight + CHART_HEADROOM_PT + 40)
  const top = doc.y + 6
  // The headroom keeps the highest point (a toe pick's tip) off the chart's top edge.
  const base = top + CHART_HEADROOM_PT + plotHeight
  const X = (x: number) => MARGIN + (x - x0) * sx
  const Y = (y: number) => base - (y - y0) * sy
  if (opts.band) doc.rect(X(opts.band[0]), top, (opts.band[1] - opts.band[0]) * sx, base - top + 4).fill(ACCENT_PALE)
  if (opts.yZeroLine) doc.moveTo(X(x0), Y(0)).lineTo(X(x1), Y(0)).lineWidth(0.5).strokeColor(STEEL).stroke()
  for (const s of opts.series) {
    const pts = s.points
    if (!pts.length) continue
    doc.moveTo(X(pts[0][0]), Y(pts[0][1]))
    for (const p of pts.slice(1)) doc.lineTo(X(p[0]), Y(p[1]))
    if (s.dash) doc.dash(3, { space: 2 })
    doc.lineWidth(1).strokeColor(s.colour).stroke().undash()
  }
  doc.font('regular').fontSize(8).fillColor(INK)
  for (const m of opts.marks ?? []) {
    doc.moveTo(X(m.x), base + 2).lineTo(X(m.x), base + 8).lineWidth(0.8).strokeColor(INK).stroke()
    doc.text(m.label, X(m.x) - 20, base + 10, { width: 40, align: 'center' })
  }
  doc.y = base + 24
  const scale = exaggeration === null ? '' : exaggeration === 1 ? 'Heights and lengths drawn to one scale. ' : `Heights drawn at ${formatFactor(exaggeration)} times the scale of lengths. `
  paragraph(doc, `${scale}${opts.caption} ${opts.series.map((s) => `${s.dash ? 'dashed' : 'solid'}: ${s.label}`).join('; ')}.`, { muted: true, size: 8 })
}
