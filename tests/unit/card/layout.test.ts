import { describe, expect, it } from 'vitest'
import { cardLayout, PAPER_SIZES_MM, type CardLayout, type Paper } from '../../../shared/card/layout'
import { cardLayoutSchema } from '../../../shared/schemas/card'

const papers: Paper[] = ['a4', 'letter']

function markerBox(m: CardLayout['markers'][number]) {
  const xs = m.cornersMm.map((p) => p[0])
  const ys = m.cornersMm.map((p) => p[1])
  return { x0: Math.min(...xs), x1: Math.max(...xs), y0: Math.min(...ys), y1: Math.max(...ys) }
}

describe.each(papers)('card layout %s', (paper) => {
  const layout = cardLayout(paper)

  it('passes its own schema and keeps the required fields first, in order', () => {
    expect(cardLayoutSchema.parse(layout)).toEqual(layout)
    expect(Object.keys(layout).slice(0, 8)).toEqual(
      ['paper', 'cardId', 'widthMm', 'heightMm', 'dictionary', 'markers', 'checkBar', 'bladeZone'])
  })

  it('uses the paper size of ISO 216 / ASME Y14.1 for both sheets', () => {
    // A4 = 210 × 297 mm (ISO 216); Letter = 8.5 × 11 in = 215.9 × 279.4 mm (ASME Y14.1, 25.4 mm per inch).
    const expected = paper === 'a4' ? [297, 210] : [11 * 25.4, 8.5 * 25.4]
    for (const sheet of layout.sheets) {
      expect(sheet.widthMm).toBeCloseTo(expected[0], 9)
      expect(sheet.heightMm).toBeCloseTo(expected[1], 9)
    }
    expect(layout.heightMm).toBeCloseTo(expected[1], 9)
  })

  it('is two sheets joined into a card of about 420–450 mm', () => {
    expect(layout.widthMm).toBeGreaterThanOrEqual(420)
    expect(layout.widthMm).toBeLessThanOrEqual(450)
    const [s1, s2] = layout.sheets
    expect(s2.offsetMm[0] + s2.widthMm).toBeCloseTo(layout.widthMm, 9)
    expect(s2.offsetMm[0] + (s2.cutLineXMm ?? NaN)).toBeCloseTo(layout.joinXMm, 9)
    // The join must lie on sheet 1's paper and the cut line on sheet 2's, each with a printer margin to spare.
    expect(layout.joinXMm).toBeLessThan(s1.widthMm - 5)
    expect(s2.cutLineXMm).toBeGreaterThan(5)
  })

  it('keeps every marker square, on its sheet, outside the blade zone and beside the longest blade', () => {
    const zone = layout.bladeZone
    const centre = zone.xMm + zone.widthMm / 2
    // 12.25 in = 311.15 mm is the longest blade size (common practice, no published source); 15 mm spare each end.
    const bladeHalf = (12.25 * 25.4) / 2 + 15
    for (const m of layout.markers) {
      const b = markerBox(m)
      expect(b.x1 - b.x0).toBeCloseTo(layout.markerSizeMm, 9)
      expect(b.y1 - b.y0).toBeCloseTo(layout.markerSizeMm, 9)
      const outsideBlade = b.x1 <= centre - bladeHalf + 0.2 || b.x0 >= centre + bladeHalf - 0.2
      expect(outsideBlade, `marker ${m.id}`).toBe(true)
      const overlapsZone = b.x1 > zone.xMm && b.x0 < zone.xMm + zone.widthMm && b.y1 > zone.yMm
      expect(overlapsZone, `marker ${m.id}`).toBe(false)
      expect(b.x0).toBeGreaterThanOrEqual(4)
      expect(b.x1).toBeLessThanOrEqual(layout.widthMm - 4)
      expect(b.y0).toBeGreaterThanOrEqual(4)
      expect(b.y1).toBeLessThanOrEqual(layout.heightMm - 4)
      const onOneSheet = b.x1 <= layout.joinXMm || b.x0 >= layout.joinXMm
      expect(onOneSheet).toBe(true)
    }
  })

  it('spans most of the card height with each marker block', () => {
    const ys = layout.markers.flatMap((m) => m.cornersMm.map((p) => p[1]))
    expect(Math.max(...ys) - Math.min(...ys)).toBeGreaterThan(0.8 * layout.heightMm)
  })

  it('has a 100 mm horizontal check bar on one sheet, clear of the blade zone', () => {
    const { fromMm, toMm } = layout.checkBar
    expect(Math.hypot(toMm[0] - fromMm[0], toMm[1] - fromMm[1])).toBeCloseTo(100, 9)
    expect(toMm[0]).toBeLessThan(layout.joinXMm)
    expect(fromMm[1]).toBeLessThan(layout.bladeZone.yMm - 20)
  })

  it('has a blade zone of about 75 mm at the table edge', () => {
    const zone = layout.bladeZone
    expect(zone.yMm + zone.heightMm).toBeCloseTo(layout.heightMm, 9)
    expect(zone.heightMm).toBeGreaterThanOrEqual(70)
    expect(zone.heightMm).toBeLessThanOrEqual(80)
  })
})

describe('both papers', () => {
  it('use disjoint marker ids and distinct card ids', () => {
    const a4 = cardLayout('a4')
    const letter = cardLayout('letter')
    const a4Ids = new Set(a4.markers.map((m) => m.id))
    expect(letter.markers.some((m) => a4Ids.has(m.id))).toBe(false)
    expect(a4.cardId).not.toBe(letter.cardId)
    expect(Object.keys(PAPER_SIZES_MM).sort()).toEqual(['a4', 'letter'])
  })
})
