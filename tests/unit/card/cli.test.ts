import { describe, expect, it } from 'vitest'
import { parseCardArgs } from '../../../server/cli/card'

describe('card CLI arguments', () => {
  it('accepts a full command line and defaults the dpi to 300', () => {
    expect(parseCardArgs(['--paper', 'a4', '--format', 'png', '--out', 'card.png']))
      .toEqual({ paper: 'a4', format: 'png', dpi: 300, out: 'card.png' })
    expect(parseCardArgs(['--paper', 'letter', '--format', 'png', '--dpi', '600', '--out', 'c.png']).dpi).toBe(600)
  })

  it('names each bad argument and shows the usage', () => {
    expect(() => parseCardArgs(['--paper', 'a3', '--format', 'pdf', '--out', 'x'])).toThrow(/--paper[\s\S]*usage:/)
    expect(() => parseCardArgs(['--paper', 'a4', '--format', 'gif', '--out', 'x'])).toThrow(/--format/)
    expect(() => parseCardArgs(['--paper', 'a4', '--format', 'png', '--dpi', 'high', '--out', 'x'])).toThrow(/--dpi/)
    expect(() => parseCardArgs(['--paper', 'a4', '--format', 'png', '--dpi', '5000', '--out', 'x'])).toThrow(/--dpi/)
    expect(() => parseCardArgs(['--paper', 'a4', '--format', 'pdf'])).toThrow(/--out: an output file is required/)
    expect(() => parseCardArgs(['--paper', 'a4', '--format', 'pdf', '--out', 'x', '--size', '2'])).toThrow(/--size/)
    expect(() => parseCardArgs(['--paper', 'a4', '--format', 'pdf', '--dpi', '300', '--out', 'x'])).toThrow(/png only/)
  })
})
