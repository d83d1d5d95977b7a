import { describe, expect, it } from 'vitest'
import { hollowDepthFromSixteenths } from '../../../shared/hollow/depth'

describe('hollowDepthFromSixteenths', () => {
  it('gives the depths of REFERENCES.md on a 4.0 mm runner: 3/8 in 0.2123, 1/2 in 0.1585, 5/8 in 0.1265 mm', () => {
    // REFERENCES.md: R − √(R² − (w/2)²), CRC Standard Mathematical Tables "circular segment", computed there.
    expect(hollowDepthFromSixteenths(6).depthMm).toBeCloseTo(0.2123, 4)
    expect(hollowDepthFromSixteenths(8, 4.0).depthMm).toBeCloseTo(0.1585, 4)
    expect(hollowDepthFromSixteenths(10, 4.0).depthMm).toBeCloseTo(0.1265, 4)
    expect(hollowDepthFromSixteenths(7).rootRadiusMm).toBeCloseTo(11.1125, 12)
  })
  it('deepens with a wider runner and a tighter radius', () => {
    expect(hollowDepthFromSixteenths(7, 4.7).depthMm).toBeGreaterThan(hollowDepthFromSixteenths(7, 3.8).depthMm)
    expect(hollowDepthFromSixteenths(5).depthMm).toBeGreaterThan(hollowDepthFromSixteenths(9).depthMm)
  })
  it('refuses widths outside 3.8–4.7 mm (common practice, no published source) and radii under 1/16 in', () => {
    expect(() => hollowDepthFromSixteenths(7, 3.5)).toThrow(RangeError)
    expect(() => hollowDepthFromSixteenths(7, 5)).toThrow(RangeError)
    expect(() => hollowDepthFromSixteenths(0)).toThrow(RangeError)
    expect(hollowDepthFromSixteenths(7, 4.7).widthMm).toBe(4.7)
  })
})
