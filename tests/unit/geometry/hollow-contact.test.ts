import { describe, expect, it } from 'vitest'
import {
  MM_PER_INCH,
  chordAtDepth,
  coinRadiusSixteenths,
  feetToMm,
  hollowDepth,
  inchesToMm,
  mmToFeet,
  mmToInches,
  mmToSixteenths,
  radiusFromSagitta,
  sagitta,
  sixteenthsToMm,
} from '../../../shared/geometry/hollow'
import { CONTACT_GAP_MM, contactLength, contactLengthSigma } from '../../../shared/geometry/contact'

describe('units', () => {
  it('uses 25.4 mm per inch exactly', () => {
    // International yard and pound agreement (1959); NBS Circular 572 addendum (1960).
    expect(MM_PER_INCH).toBe(25.4)
    expect(inchesToMm(12.25)).toBeCloseTo(311.15, 10)
    expect(mmToInches(203.2)).toBeCloseTo(8, 12)
  })
  it('converts sixteenths: 3/8 = 9.525, 7/16 = 11.1125, 1/2 = 12.7, 9/16 = 14.2875, 5/8 = 15.875 mm', () => {
    // REFERENCES.md: n/16 in = n × 1.5875 mm.
    expect(sixteenthsToMm(6)).toBeCloseTo(9.525, 12)
    expect(sixteenthsToMm(7)).toBeCloseTo(11.1125, 12)
    expect(sixteenthsToMm(8)).toBeCloseTo(12.7, 12)
    expect(sixteenthsToMm(9)).toBeCloseTo(14.2875, 12)
    expect(sixteenthsToMm(10)).toBeCloseTo(15.875, 12)
    expect(mmToSixteenths(12.7)).toBeCloseTo(8, 12)
  })
  it('converts feet: a 7 ft rocker is 2133.6 mm, 8 ft 2438.4 mm', () => {
    // REFERENCES.md: 7 ft (2133.6 mm), 8 ft (2438.4 mm).
    expect(feetToMm(7)).toBeCloseTo(2133.6, 10)
    expect(feetToMm(8)).toBeCloseTo(2438.4, 10)
    expect(mmToFeet(2133.6)).toBeCloseTo(7, 12)
  })
  it('finds the coin radius in sixteenths: a US or Canadian 1¢ (19.05 mm) checks exactly 6/16 in', () => {
    // United States Mint / Royal Canadian Mint: 1¢ diameter 19.05 mm; REFERENCES.md: radius 9.525 mm = 6/16 in.
    expect(coinRadiusSixteenths(19.05)).toBeCloseTo(6, 10)
    // US 25¢ 24.26 mm (United States Mint) is within 0.57 mm of 8/16 in (REFERENCES.md).
    expect(Math.abs(sixteenthsToMm(coinRadiusSixteenths(24.26)) - 12.7)).toBeLessThan(0.57)
  })
})

describe('circular segment', () => {
  it('gives sagitta 2 for r = 5, c = 8 and inverts it', () => {
    // CRC Standard Mathematical Tables, "circular segment" (REFERENCES.md).
    expect(sagitta(5, 8)).toBeCloseTo(2, 12)
    expect(radiusFromSagitta(2, 8)).toBeCloseTo(5, 12)
  })
  it('gives a rocker sag over a 280 mm chord of 4.598 mm at 7 ft and 4.022 mm at 8 ft', () => {
    // REFERENCES.md, computed from the same formula.
    expect(sagitta(feetToMm(7), 280)).toBeCloseTo(4.598, 3)
    expect(sagitta(feetToMm(8), 280)).toBeCloseTo(4.022, 3)
  })
  it('gives hollow depths on a 4.0 mm runner: 3/8 in 0.2123, 1/2 in 0.1585, 5/8 in 0.1265 mm', () => {
    // REFERENCES.md: R − √(R² − (w/2)²), computed.
    expect(hollowDepth(sixteenthsToMm(6), 4)).toBeCloseTo(0.2123, 4)
    expect(hollowDepth(sixteenthsToMm(8), 4)).toBeCloseTo(0.1585, 4)
    expect(hollowDepth(sixteenthsToMm(10), 4)).toBeCloseTo(0.1265, 4)
  })
  it('gives the chord at a depth, c = 2√(2Rd − d²), consistent with the sagitta', () => {
    expect(chordAtDepth(5, 2)).toBeCloseTo(8, 12)
    expect(() => sagitta(1, 3)).toThrow(RangeError)
    expect(() => radiusFromSagitta(0, 3)).toThrow(RangeError)
  })
})

describe('contact length', () => {
  it('is the chord within 2 µm of the tangent, 2√(2Rδ), matching the exact chord at that depth', () => {
    // δ = 2 µm is a convention from memory (DESIGN §4.5); the chord formula is CRC's (REFERENCES.md).
    expect(CONTACT_GAP_MM).toBe(0.002)
    for (const r of [1500, feetToMm(7), feetToMm(8)]) expect(contactLength(r)).toBeCloseTo(chordAtDepth(r, 0.002), 5)
    expect(contactLength(feetToMm(7))).toBeCloseTo(2 * Math.sqrt(2 * 2133.6 * 0.002), 12)
    expect(() => contactLength(0)).toThrow(RangeError)
  })
  it('propagates a relative radius error at half strength (c ∝ √R)', () => {
    const r = 2000
    const rel = 0.04
    const numeric = (contactLength(r * (1 + 1e-6)) - contactLength(r)) / (1e-6 * r)
    expect(contactLengthSigma(r, rel)).toBeCloseTo(numeric * r * rel, 6)
  })
})
