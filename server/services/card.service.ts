import { createRequire } from 'node:module'
import PDFDocument from 'pdfkit'
import sharp from 'sharp'
import { markerGrid, MARKER_CELLS } from '../../shared/card/aruco-dict'
import { cardLayout, type CardLayout } from '../../shared/card/layout'
import { printPlan, type PrintItem, type SheetPlan } from '../../shared/card/print-plan'
import { CARD_DPI, type CardFormat, type Paper } from '../../shared/schemas/card'

export interface RenderCardOptions {
  /** PNG resolution, dots per inch; ignored by PDF and JSON. */
  dpi?: number
}

/** A greyscale raster of the assembled card: one byte per pixel (0 black … 255 white), row-major. */
export interface CardRaster { data: Uint8Array; width: number; height: number; pxPerMm: number }

export const DEFAULT_DPI = CARD_DPI.default
export const MAX_DPI = CARD_DPI.max
const PT_PER_MM = 72 / 25.4
const FONT_DIR = createRequire(import.meta.url).resolve('@fontsource/ibm-plex-sans/package.json').replace(/package\.json$/, 'files/')
const FONTS = { regular: `${FONT_DIR}ibm-plex-sans-latin-400-normal.woff`, bold: `${FONT_DIR}ibm-plex-sans-latin-600-normal.woff` }

/** The card as PDF (one page per sheet), PNG (the assembled card at `dpi`) or JSON (its layout). */
export async function renderCard(paper: Paper, format: CardFormat, options: RenderCardOptions = {}): Promise<Buffer> {
  if (format === 'json') return Buffer.from(`${JSON.stringify(cardLayout(paper), null, 2)}\n`)
  if (format === 'pdf') return renderCardPdf(paper)
  return renderCardPng(paper, options.dpi ?? CARD_DPI.default)
}

function checkDpi(dpi: number): void {
  if (!Number.isFinite(dpi) || dpi < CARD_DPI.min || dpi > CARD_DPI.max) {
    throw new RangeError(`dpi must be ${CARD_DPI.min}–${CARD_DPI.max}, got ${dpi}`)
  }
}

const grey255 = (g: number) => Math.round(g * 255)

function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')
}

/** One printed primitive as SVG in sheet mm; markers are left out and drawn as exact pixel blocks afterwards. */
function svgItem(item: PrintItem): string {
  if (item.kind === 'line') {
    const dash = item.dashMm ? ` stroke-dasharray="${item.dashMm.join(' ')}"` : ''
    const g = grey255(item.grey)
    return `<line x1="${item.from[0]}" y1="${item.from[1]}" x2="${item.to[0]}" y2="${item.to[1]}" stroke="rgb(${g},${g},${g})" stroke-width="${item.widthMm}"${dash}/>`
  }
  if (item.kind === 'polygon') {
    const g = grey255(item.grey)
    return `<polygon points="${item.points.map((p) => p.join(',')).join(' ')}" fill="rgb(${g},${g},${g})"/>`
  }
  if (item.kind === 'text') {
    const g = grey255(item.grey)
    const rotate = item.rotateDeg ? ` transform="rotate(${-item.rotateDeg} ${item.xMm} ${item.yMm})"` : ''
    return `<text x="${item.xMm}" y="${item.yMm}" font-family="IBM Plex Sans, DejaVu Sans, sans-serif" font-size="${item.sizeMm}" font-weight="${item.bold ? 600 : 400}" fill="rgb(${g},${g},${g})"${rotate}>${escapeXml(item.text)}</text>`
  }
  return ''
}

/** The assembled card as SVG: sheet 1, then sheet 2 on top of it, each clipped to the strip that shows. */
function assembledSvg(layout: CardLayout, plans: SheetPlan[], widthPx: number, heightPx: number): string {
  const groups = plans.map(({ sheet, items }, i) => {
    const [x0, x1] = sheet.visibleXMm
    const [ox, oy] = sheet.offsetMm
    return `<clipPath id="s${i}"><rect x="${x0}" y="0" width="${x1 - x0}" height="${layout.heightMm}"/></clipPath>` +
      `<g clip-path="url(#s${i})"><rect x="${x0}" y="0" width="${x1 - x0}" height="${layout.heightMm}" fill="white"/>` +
      `<g transform="translate(${ox} ${oy})">${items.map(svgItem).join('')}</g></g>`
  })
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" ` +
    `viewBox="0 0 ${layout.widthMm} ${layout.heightMm}">${groups.join('')}</svg>`
}

/** Fills each marker cell as a block of whole pixels, its edges at the nearest pixel boundary to the mm position. */
function drawMarkers(raster: CardRaster, layout: CardLayout): void {
  const { data, width, pxPerMm } = raster
  const cellMm = layout.markerSizeMm / MARKER_CELLS
  for (const marker of layout.markers) {
    const [x0, y0] = marker.cornersMm[0]
    const grid = markerGrid(marker.id)
    for (let row = 0; row < MARKER_CELLS; row++) {
      const r0 = Math.round((y0 + row * cellMm) * pxPerMm)
      const r1 = Math.round((y0 + (row + 1) * cellMm) * pxPerMm)
      for (let col = 0; col < MARKER_CELLS; col++) {
        const c0 = Math.round((x0 + col * cellMm) * pxPerMm)
        const c1 = Math.round((x0 + (col + 1) * cellMm) * pxPerMm)
        const value = grid[row * MARKER_CELLS + col] ? 255 : 0
        for (let r = r0; r < r1; r++) data.fill(value, r * width + c0, r * width + c1)
      }
    }
  }
}

/**
 * The assembled card as a greyscale raster at `pxPerMm`; pixel (i, j) covers card mm [i, i+1) / pxPerMm.
 * Used for the PNG download and as the texture of synthetic photos.
 */
export async function renderCardRaster(paper: Paper, pxPerMm: number): Promise<CardRaster> {
  const layout = cardLayout(paper)
  const width = Math.round(layout.widthMm * pxPerMm)
  const height = Math.round(layout.heightMm * pxPerMm)
  const svg = assembledSvg(layout, printPlan(paper), width, height)
  const { data } = await sharp(Buffer.from(svg), { density: 72 })
    .flatten({ background: '#ffffff' }).greyscale().extractChannel(0).raw()
    .toBuffer({ resolveWithObject: true })
  const raster: CardRaster = { data: new Uint8Array(data.buffer, data.byteOffset, data.length), width, height, pxPerMm }
  drawMarkers(raster, layout)
  return raster
}

async function renderCardPng(paper: Paper, dpi: number): Promise<Buffer> {
  checkDpi(dpi)
  const raster = await renderCardRaster(paper, dpi / 25.4)
  return sharp(raster.data, { raw: { width: raster.width, height: raster.height, channels: 1 } })
    .withMetadata({ density: dpi }).png({ compressionLevel: 9 }).toBuffer()
}

function pdfItem(doc: PDFKit.PDFDocument, item: PrintItem): void {
  const mm = (v: number) => v * PT_PER_MM
  const g = grey255(item.kind === 'marker' ? 0 : item.grey)
  const colour: [number, number, number] = [g, g, g]
  if (item.kind === 'line') {
    doc.save().lineWidth(mm(item.widthMm)).strokeColor(colour)
    if (item.dashMm) doc.dash(mm(item.dashMm[0]), { space: mm(item.dashMm[1]) })
    doc.moveTo(mm(item.from[0]), mm(item.from[1])).lineTo(mm(item.to[0]), mm(item.to[1])).stroke().restore()
  } else if (item.kind === 'polygon') {
    doc.polygon(...item.points.map(([x, y]) => [mm(x), mm(y)])).fill(colour)
  } else if (item.kind === 'text') {
    doc.save()
    if (item.rotateDeg) doc.rotate(-item.rotateDeg, { origin: [mm(item.xMm), mm(item.yMm)] })
    doc.font(item.bold ? FONTS.bold : FONTS.regular).fontSize(mm(item.sizeMm)).fillColor(colour)
      .text(item.text, mm(item.xMm), mm(item.yMm), { baseline: 'alphabetic', lineBreak: false })
    doc.restore()
  } else {
    pdfMarker(doc, item, mm)
  }
}

/** A black square with all white cells in one path, filled once, so viewers show no seams between cells. */
function pdfMarker(doc: PDFKit.PDFDocument, item: PrintItem & { kind: 'marker' }, mm: (v: number) => number): void {
  const cell = item.sizeMm / MARKER_CELLS
  doc.rect(mm(item.xMm), mm(item.yMm), mm(item.sizeMm), mm(item.sizeMm)).fill('black')
  const grid = markerGrid(item.id)
  grid.forEach((white, k) => {
    if (white) doc.rect(mm(item.xMm + (k % MARKER_CELLS) * cell), mm(item.yMm + Math.floor(k / MARKER_CELLS) * cell), mm(cell), mm(cell))
  })
  doc.fill('white')
}

async function renderCardPdf(paper: Paper): Promise<Buffer> {
  const layout = cardLayout(paper)
  const doc = new PDFDocument({ autoFirstPage: false, info: { Title: `Rockerbook scale card ${layout.cardId}` } })
  const chunks: Buffer[] = []
  doc.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  for (const { sheet, items } of printPlan(paper)) {
    // Exact page size in points from the sheet's mm (A4 landscape 841.89 × 595.28, Letter 792 × 612).
    doc.addPage({ size: [sheet.widthMm * PT_PER_MM, sheet.heightMm * PT_PER_MM], margin: 0 })
    for (const item of items) pdfItem(doc, item)
  }
  doc.end()
  return done
}
