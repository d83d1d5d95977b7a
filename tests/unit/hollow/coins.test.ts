import { describe, expect, it } from 'vitest'
import { COINS, coinCheck, coinTable, coinsForRootRadius, type Coin } from '../../../shared/hollow/coins'

const byId = (id: string): Coin => {
  const coin = COINS.find((c) => c.id === id)
  if (!coin) throw new Error(`no coin ${id}`)
  return coin
}

describe('coin list', () => {
  it('holds the published diameters', () => {
    // United States Mint, coin specifications (REFERENCES.md).
    expect(byId('us-1c').diameterMm).toBe(19.05)
    expect(byId('us-5c').diameterMm).toBe(21.21)
    expect(byId('us-25c').diameterMm).toBe(24.26)
    // Royal Canadian Mint (REFERENCES.md).
    expect(byId('ca-2d').diameterMm).toBe(28.0)
    expect(byId('ca-25c').diameterMm).toBe(23.88)
    // Council Regulation (EC) No 975/98 (REFERENCES.md).
    expect(byId('eu-50c').diameterMm).toBe(24.25)
    expect(byId('eu-2e').diameterMm).toBe(25.75)
    // The Royal Mint (REFERENCES.md).
    expect(byId('uk-2p').diameterMm).toBe(25.9)
    expect(byId('uk-2l').diameterMm).toBe(28.4)
  })
  it('leaves out the coins that are not round (REFERENCES.md): Canada $1, UK 20p, 50p and £1, euro 20c', () => {
    const labels = COINS.map((c) => `${c.issuer} ${c.denomination}`)
    for (const notRound of ['Canada $1', 'UK 20p', 'UK 50p', 'UK £1', 'euro 20 cent']) {
      expect(labels).not.toContain(notRound)
    }
    expect(COINS).toHaveLength(22)
    expect(new Set(COINS.map((c) => c.id)).size).toBe(COINS.length)
  })
  it('names the issuing mint or regulation as the source of every diameter', () => {
    const sources: Record<Coin['issuer'], RegExp> = {
      US: /United States Mint/,
      Canada: /Royal Canadian Mint/,
      'euro': /Council Regulation \(EC\) No 975\/98/,
      UK: /The Royal Mint/,
    }
    for (const coin of COINS) expect(coin.source).toMatch(sources[coin.issuer])
  })
})

describe('the root radius each coin checks', () => {
  it('finds that a US or Canadian 1¢ (radius 9.525 mm) checks exactly 6/16 in', () => {
    // United States Mint / Royal Canadian Mint 19.05 mm; REFERENCES.md: 9.525 mm = exactly 6/16 in at 25.4 mm/in.
    for (const id of ['us-1c', 'ca-1c']) {
      const c = coinCheck(byId(id))
      expect(c.radiusMm).toBeCloseTo(9.525, 12)
      expect(c.checksSixteenths).toBe(6)
      expect(c.offsetMm).toBeCloseTo(0, 12)
    }
  })
  it('finds a US 5¢ (10.605 mm) within 0.51 mm of 7/16 in', () => {
    // United States Mint 21.21 mm; REFERENCES.md useful equalities. 7/16 in = 11.1125 mm.
    const c = coinCheck(byId('us-5c'))
    expect(c.checksSixteenths).toBe(7)
    expect(c.offsetMm).toBeCloseTo(10.605 - 11.1125, 12)
    expect(Math.abs(c.offsetMm)).toBeLessThan(0.51)
  })
  it('finds a US 25¢ and a euro 50c close to 8/16 in (about 0.57 mm small)', () => {
    // United States Mint 24.26 mm, Council Regulation (EC) No 975/98 24.25 mm; REFERENCES.md gives "within 0.57 mm",
    // rounded: by 25.4 mm/in, 12.7 − 12.13 = 0.570 and 12.7 − 12.125 = 0.575.
    const us = coinCheck(byId('us-25c'))
    const eu = coinCheck(byId('eu-50c'))
    expect([us.checksSixteenths, eu.checksSixteenths]).toEqual([8, 8])
    expect(us.offsetMm).toBeCloseTo(-0.57, 9)
    expect(eu.offsetMm).toBeCloseTo(-0.575, 9)
  })
  it('matches a hand computation of the nearest sixteenth for every coin (radius ÷ 1.5875 mm, rounded)', () => {
    // Computed by hand from the published diameters and 25.4 mm per inch (REFERENCES.md).
    const expected: Record<string, number> = {
      'us-1c': 6, 'us-5c': 7, 'us-10c': 6, 'us-25c': 8, 'us-50c': 10, 'us-1d': 8,
      'ca-1c': 6, 'ca-5c': 7, 'ca-10c': 6, 'ca-25c': 8, 'ca-2d': 9,
      'eu-1c': 5, 'eu-2c': 6, 'eu-5c': 7, 'eu-10c': 6, 'eu-50c': 8, 'eu-2e': 8,
      'uk-1p': 6, 'uk-2p': 8, 'uk-5p': 6, 'uk-10p': 8, 'uk-2l': 9,
    }
    for (const coin of COINS) {
      const c = coinCheck(coin)
      expect(c.checksSixteenths, coin.id).toBe(expected[coin.id])
      expect(Math.abs(c.offsetMm)).toBeLessThanOrEqual(1.5875 / 2)
    }
  })
  it('sorts the table by the sixteenth checked, closest fit first, and lists the coins for one radius', () => {
    const table = coinTable()
    for (let i = 1; i < table.length; i++) expect(table[i].checksSixteenths).toBeGreaterThanOrEqual(table[i - 1].checksSixteenths)
    expect(table[0].id).toBe('eu-1c')
    const six = coinsForRootRadius(6)
    expect(six.slice(0, 2).map((c) => c.id).sort()).toEqual(['ca-1c', 'us-1c'])
    expect(coinsForRootRadius(4)).toEqual([])
  })
})
