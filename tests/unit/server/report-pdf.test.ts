import { describe, expect, it } from 'vitest'
import { fittedExaggeration, INK, lineChart, newReport } from '../../../server/services/report-pdf'
import type { Vec2 } from '../../../shared/geometry/vec'
import { pdfText } from '../../support/pdf'

/** A flat 250 mm runner with a toe pick rising to `pickMm` at its front end. */
const profile = (pickMm: number): Vec2[] => [[-20, pickMm], [-10, pickMm / 2], [0, 0], [230, 0], [230, 12]]

async function captionFor(pickMm: number): Promise<string> {
  const { doc, bytes } = newReport('Chart')
  lineChart(doc, { series: [{ points: profile(pickMm), colour: INK, label: 'edge' }], heightPt: 220, yExaggeration: 5, caption: 'Shaded: target.' })
  doc.end()
  return pdfText(await bytes)
}

describe('lineChart with a vertical exaggeration', () => {
  it('keeps the exaggeration asked for while the heights fit, and says it', async () => {
    // 250 mm across 499.28 pt (A4 less two 48 pt margins) is 2.0 pt/mm; at 5× a 14 mm pick needs 140 pt of 220.
    expect(await captionFor(14)).toContain('Heights drawn at 5 times the scale of lengths. Shaded: target.')
  })

  it('lowers the exaggeration to fit a tall toe pick whole instead of cutting it off, and says the one drawn', async () => {
    // 220 pt / (30 mm · 1.997 pt/mm) = 3.67, so the largest half step that fits is 3.5.
    expect(await captionFor(30)).toContain('Heights drawn at 3.5 times the scale of lengths.')
  })

  it('picks the largest half step that fits, or the exact fit below 1', () => {
    expect(fittedExaggeration(5, 7.2)).toBe(5)
    expect(fittedExaggeration(5, 3.67)).toBe(3.5)
    expect(fittedExaggeration(5, 1.2)).toBe(1)
    expect(fittedExaggeration(5, 0.6)).toBe(0.6)
  })
})
