import { describe, expect, it } from 'vitest'
import { CAPTURE_STEPS, HANDLING_CAUTIONS, wrapText } from '../../../shared/card/wording'

describe('card wording', () => {
  it('wraps text within the budget without losing or splitting words', () => {
    const text = 'Stand this card upright right behind the runner, touching it, its bottom edge on the table.'
    const lines = wrapText(text, 30)
    for (const line of lines) expect(line.length).toBeLessThanOrEqual(30)
    expect(lines.join(' ')).toBe(text)
    expect(wrapText('unbreakable-long-word', 5)).toEqual(['unbreakable-long-word'])
  })

  it('carries the three handling cautions of DESIGN §10 and the capture distance', () => {
    expect(HANDLING_CAUTIONS.join(' ')).toMatch(/guards on the toe picks/)
    expect(HANDLING_CAUTIONS.join(' ')).toMatch(/boot, not the blade/)
    expect(HANDLING_CAUTIONS.join(' ')).toMatch(/fingers off the edge/)
    expect(CAPTURE_STEPS.join(' ')).toMatch(/30–60 cm/)
  })
})
