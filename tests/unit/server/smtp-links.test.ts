import { describe, expect, it } from 'vitest'
import { linksIn } from '../../../server/local/smtp-fake'

describe('linksIn', () => {
  it('finds links in order and trims sentence punctuation', () => {
    const text = 'Verify: http://127.0.0.1:5180/verify?token=a1b2. Or reset at https://x.test/reset?token=z, later.'
    expect(linksIn(text)).toEqual(['http://127.0.0.1:5180/verify?token=a1b2', 'https://x.test/reset?token=z'])
  })
})
