import sharp from 'sharp'
import { describe, expect, it } from 'vitest'
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs'
import { markerGrid } from '../../../shared/card/aruco-dict'
import { cardLayout, type Paper } from '../../../shared/card/layout'
import { cardLayoutSchema } from '../../../shared/schemas/card'
import { renderCard, renderCardRaster } from '../../../server/services/card.service'
import { detectMarkers } from './opencv'

const MM_PER_PT = 25.4 / 72
const papers: Paper[] = ['a4', 'letter']

async function pdfPages(buffer: Buffer) {
  const doc = await getDocument({ data: new Uint8Array(buffer), useSystemFonts: false, verbosity: 0 }).promise
  const pages = []
  for (let n = 1; n <= doc.numPages; n++) {
    const page = await doc.getPage(n)
    const [x0, y0, x1, y1] = page.view
    const content = await page.getTextContent()
    const text = content.items.map((i) => ('str' in i ? i.str : '')).join(' ')
    pages.push({ widthMm: (x1 - x0) * MM_PER_PT, heightMm: (y1 - y0) * MM_PER_PT, text })
  }
  await doc.destroy()
  return pages
}

interface PdfMarker { x0: number; y0: number; size: number; white: Set<string> }

/**
 * Marker squares drawn on one PDF page, read back from pdfjs's operator list: each black square's bounding box (mm,
 * top-down as pdfkit writes it) and the cells of the white path that follows it.
 */
async function pdfMarkers(buffer: Buffer, pageNumber: number): Promise<PdfMarker[]> {
  const doc = await getDocument({ data: new Uint8Array(buffer), verbosity: 0 }).promise
  const ops = await (await doc.getPage(pageNumber)).getOperatorList()
  await doc.destroy()
  const markers: PdfMarker[] = []
  let fill = ''
  ops.fnArray.forEach((fn, i) => {
    const args = ops.argsArray[i] as unknown[]
    if (fn === OPS.setFillRGBColor) fill = String(args[0])
    if (fn !== OPS.constructPath) return
    const box = Array.from(args[2] as ArrayLike<number>, (v) => v * MM_PER_PT)
    const square = Math.abs(box[2] - box[0] - (box[3] - box[1])) < 0.01 && box[2] - box[0] > 15
    if (fill === '#000000' && square) markers.push({ x0: box[0], y0: box[1], size: box[2] - box[0], white: new Set() })
    else if (fill === '#ffffff' && markers.length && markers[markers.length - 1].white.size === 0) {
      const m = markers[markers.length - 1]
      const path = Array.from((args[1] as ArrayLike<number>[])[0])
      for (let k = 0; k + 12 < path.length; k += 13) {
        const cell = m.size / 6
        m.white.add(`${Math.round((path[k + 1] * MM_PER_PT - m.x0) / cell)},${Math.round((path[k + 2] * MM_PER_PT - m.y0) / cell)}`)
      }
    }
  })
  return markers
}

describe.each(papers)('card rendering %s', (paper) => {
  const layout = cardLayout(paper)

  it('PDF has one landscape page per sheet at the exact paper size', async () => {
    const pages = await pdfPages(await renderCard(paper, 'pdf'))
    expect(pages).toHaveLength(2)
    // A4 = 297 × 210 mm landscape (ISO 216); Letter = 11 × 8.5 in = 279.4 × 215.9 mm (ASME Y14.1; 25.4 mm per inch).
    const [w, h] = paper === 'a4' ? [297, 210] : [11 * 25.4, 8.5 * 25.4]
    for (const page of pages) {
      expect(page.widthMm).toBeCloseTo(w, 1)
      expect(page.heightMm).toBeCloseTo(h, 1)
    }
    expect(pages[0].text).toContain(layout.cardId)
    expect(pages[0].text).toContain('100 mm check bar')
    expect(pages[1].text).toContain('Hold the boot, not the blade.')
    expect(pages[1].text).toContain('Keep the guards on the toe picks.')
    expect(pages[1].text).toMatch(/fingers off the edge/)
  }, 30_000)

  it('PDF draws every marker of each sheet at its layout position and size, with its dictionary cells', async () => {
    const pdf = await renderCard(paper, 'pdf')
    for (const [index, sheet] of layout.sheets.entries()) {
      const drawn = await pdfMarkers(pdf, index + 1)
      const onSheet = layout.markers.filter((m) => m.cornersMm[0][0] >= sheet.visibleXMm[0] && m.cornersMm[1][0] <= sheet.visibleXMm[1])
      expect(drawn).toHaveLength(onSheet.length)
      for (const marker of onSheet) {
        const x = marker.cornersMm[0][0] - sheet.offsetMm[0]
        const y = marker.cornersMm[0][1] - sheet.offsetMm[1]
        const match = drawn.find((d) => Math.abs(d.x0 - x) < 0.01 && Math.abs(d.y0 - y) < 0.01)
        expect(match, `marker ${marker.id}`).toBeDefined()
        expect(match!.size).toBeCloseTo(layout.markerSizeMm, 2)
        const expected = new Set(markerGrid(marker.id).flatMap((white, k) => (white ? [`${k % 6},${Math.floor(k / 6)}`] : [])))
        expect(match!.white).toEqual(expected)
      }
    }
  }, 30_000)

  it('PDF draws the check bar 100 mm long between its end ticks', async () => {
    const doc = await getDocument({ data: new Uint8Array(await renderCard(paper, 'pdf')), verbosity: 0 }).promise
    const ops = await (await doc.getPage(1)).getOperatorList()
    await doc.destroy()
    const boxes = ops.fnArray.flatMap((fn, i) => fn === OPS.constructPath
      ? [Array.from((ops.argsArray[i] as unknown[])[2] as ArrayLike<number>, (v) => v * MM_PER_PT)] : [])
    const { fromMm, toMm } = layout.checkBar
    const rule = boxes.find((b) => Math.abs(b[1] - fromMm[1]) < 0.01 && Math.abs(b[3] - fromMm[1]) < 0.01)
    expect(rule).toBeDefined()
    expect(rule![0]).toBeCloseTo(fromMm[0], 2)
    expect(rule![2] - rule![0]).toBeCloseTo(100, 2)
    const ticks = boxes.filter((b) => Math.abs(b[2] - b[0]) < 0.01 && b[1] < fromMm[1] && b[3] > fromMm[1] && b[0] < toMm[0] + 1)
    expect(ticks.map((b) => b[0]).sort((a, b) => a - b)).toEqual([
      expect.closeTo(fromMm[0], 2), expect.closeTo(toMm[0], 2),
    ])
  }, 30_000)

  it('PNG has the pixel size of the card at the requested dpi', async () => {
    const dpi = 150
    const meta = await sharp(await renderCard(paper, 'png', { dpi })).metadata()
    expect(meta.format).toBe('png')
    expect(meta.width).toBe(Math.round((layout.widthMm / 25.4) * dpi))
    expect(meta.height).toBe(Math.round((layout.heightMm / 25.4) * dpi))
    expect(meta.density).toBe(dpi)
  }, 30_000)

  it('PNG markers are found by opencv at the layout positions', async () => {
    const pxPerMm = 6
    const raster = await renderCardRaster(paper, pxPerMm)
    const found = await detectMarkers(raster.data, raster.width, raster.height)
    expect([...found.keys()].sort((a, b) => a - b)).toEqual(layout.markers.map((m) => m.id).sort((a, b) => a - b))
    for (const marker of layout.markers) {
      const corners = found.get(marker.id)!
      marker.cornersMm.forEach(([x, y], k) => {
        // opencv reports corners on pixel centres of the outermost dark pixels: within a pixel of the mm position.
        expect(Math.abs(corners[k][0] - x * pxPerMm)).toBeLessThan(1.01)
        expect(Math.abs(corners[k][1] - y * pxPerMm)).toBeLessThan(1.01)
      })
    }
  }, 30_000)

  it('JSON is the layout and passes the schema', async () => {
    const parsed = cardLayoutSchema.parse(JSON.parse((await renderCard(paper, 'json')).toString('utf8')))
    expect(parsed).toEqual(layout)
  }, 30_000)

  it('leaves the blade zone blank so nothing printed competes with the runner', async () => {
    const raster = await renderCardRaster(paper, 4)
    const z = layout.bladeZone
    let dark = 0
    for (let y = Math.ceil(z.yMm * 4) + 1; y < raster.height; y++) {
      for (let x = Math.ceil(z.xMm * 4) + 1; x < Math.floor((z.xMm + z.widthMm) * 4) - 1; x++) {
        // The cut edge of sheet 2 is the one allowed mark: its dashed line straddles the join.
        if (Math.abs(x / 4 - layout.joinXMm) < 1) continue
        if (raster.data[y * raster.width + x] < 200) dark++
      }
    }
    expect(dark).toBe(0)
  }, 30_000)
})

describe('renderCard arguments', () => {
  it('refuses a dpi out of range', async () => {
    await expect(renderCard('a4', 'png', { dpi: 5 })).rejects.toThrow(/dpi/)
    await expect(renderCard('a4', 'png', { dpi: Number.NaN })).rejects.toThrow(/dpi/)
  })
})
