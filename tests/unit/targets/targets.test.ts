import { describe, expect, it } from 'vitest'
import {
  METRIC_INFO,
  formatBand,
  isHockeyGrind,
  platformDefaults,
  touchPointUpperMm,
} from '../../../shared/targets/bands'
import { bandWidth, readAgainstTarget } from '../../../shared/targets/read'
import { isValidBand, resolveTargets } from '../../../shared/targets/resolve'

describe('platform default bands (DESIGN.md §5)', () => {
  it('reads the trade defaults: touch point 35–45 mm, heel lift 15–35 mm, contact under 5 mm, root 5/16–8/16 in', () => {
    // Common practice, no published source (REFERENCES.md "Trade facts").
    const d = platformDefaults({ sizeIn: 9.5 })
    expect(d.touchPointMm).toEqual({ min: 35, max: 45 })
    expect(d.heelLiftMm).toEqual({ min: 15, max: 35 })
    expect(d.contactLengthMm).toEqual({ min: null, max: 5 })
    expect(d.rootRadiusSixteenths).toEqual({ min: 5, max: 8 })
    expect(METRIC_INFO.touchPointMm.basis).toBe('common practice, no published source')
  })
  it('uses our left vs right rule: touch point within 3 mm, heel lift within 2 mm', () => {
    // Our rule (DESIGN.md §5), not a trade figure.
    const d = platformDefaults({ sizeIn: 9.5 })
    expect(d.pairTouchPointDiffMm).toEqual({ min: null, max: 3 })
    expect(d.pairHeelLiftDiffMm).toEqual({ min: null, max: 2 })
    expect(METRIC_INFO.pairTouchPointDiffMm.basis).toBe('our rule')
  })
  it('moves the upper touch-point limit back 2 mm per 1/4 in over 10.5 in (our rule)', () => {
    expect(touchPointUpperMm(8)).toBe(45)
    expect(touchPointUpperMm(10.5)).toBe(45)
    expect(touchPointUpperMm(10.75)).toBe(47)
    expect(touchPointUpperMm(11)).toBe(49)
    expect(touchPointUpperMm(12.25)).toBe(59)
    expect(platformDefaults({ sizeIn: 11.5 }).touchPointMm).toEqual({ min: 35, max: 53 })
  })
  it('flags 9/16 in and flatter as a hockey grind (common practice, no published source)', () => {
    expect(isHockeyGrind(8)).toBe(false)
    expect(isHockeyGrind(9)).toBe(true)
    expect(isHockeyGrind(10)).toBe(true)
  })
  it('writes bands for people', () => {
    expect(formatBand({ min: 35, max: 45 }, 'mm')).toBe('35–45 mm')
    expect(formatBand({ min: null, max: 5 }, 'mm')).toBe('under 5 mm')
    expect(formatBand({ min: 15, max: null }, 'mm')).toBe('at least 15 mm')
    expect(formatBand({ min: 5, max: 8 }, '/16 in')).toBe('5/16–8/16 in')
  })
})

describe('readAgainstTarget', () => {
  const band = { min: 35, max: 45 } // width 10 mm: 10 % outside = 1 mm
  it('reads a value well inside as on target', () => {
    expect(readAgainstTarget(40, 1.5, band)).toBe('on target')
  })
  it('reads a value inside but within its ± of an edge as near limit', () => {
    expect(readAgainstTarget(44, 1.5, band)).toBe('near limit')
    expect(readAgainstTarget(36.4, 1.5, band)).toBe('near limit')
    expect(readAgainstTarget(36.6, 1.5, band)).toBe('on target')
    expect(readAgainstTarget(44, 0.5, band)).toBe('on target')
  })
  it('counts a value exactly on an edge as near limit, even with no ±', () => {
    expect(readAgainstTarget(45, 0, band)).toBe('near limit')
    expect(readAgainstTarget(35, 0, band)).toBe('near limit')
  })
  it('reads up to 10 % of the band width outside as near limit, beyond it as off target', () => {
    expect(readAgainstTarget(46, 0, band)).toBe('near limit')
    expect(readAgainstTarget(34, 0, band)).toBe('near limit')
    expect(readAgainstTarget(46.01, 0, band)).toBe('off target')
    expect(readAgainstTarget(33.9, 0.2, band)).toBe('off target')
  })
  it('reads one-sided bands as running from zero to the limit', () => {
    const contact = { min: null, max: 5 } // 10 % of 5 mm = 0.5 mm
    expect(bandWidth(contact)).toBe(5)
    expect(readAgainstTarget(1, 0.2, contact)).toBe('on target')
    expect(readAgainstTarget(4.9, 0.2, contact)).toBe('near limit')
    expect(readAgainstTarget(5.4, 0.2, contact)).toBe('near limit')
    expect(readAgainstTarget(5.6, 0.2, contact)).toBe('off target')
    const lower = { min: 15, max: null }
    expect(readAgainstTarget(100, 1, lower)).toBe('on target')
    expect(readAgainstTarget(14, 0, lower)).toBe('near limit')
    expect(readAgainstTarget(13, 0, lower)).toBe('off target')
  })
  it('reads a root radius in sixteenths: 9/16 is off the 5–8 band', () => {
    const root = platformDefaults({ sizeIn: 9 }).rootRadiusSixteenths
    expect(readAgainstTarget(7, 0, root)).toBe('on target')
    expect(readAgainstTarget(8, 0, root)).toBe('near limit')
    expect(readAgainstTarget(9, 0, root)).toBe('off target')
  })
  it('refuses a value that is not a number', () => {
    expect(() => readAgainstTarget(Number.NaN, 0, band)).toThrow(RangeError)
  })
})

describe('resolveTargets', () => {
  const coach = { accountId: 'c1', displayName: 'Coach', role: 'coach' }
  const tech = { accountId: 't1', displayName: 'Technician', role: 'technician' }
  it('gives the platform defaults when nobody has set anything', () => {
    const r = resolveTargets({ blade: { sizeIn: 11 } })
    expect(r.touchPointMm.layer).toBe('platform')
    expect(r.touchPointMm.band).toEqual({ min: 35, max: 49 })
    expect(r.touchPointMm.setBy).toBeNull()
  })
  it('layers platform < shop < skater < blade, metric by metric, keeping who set it and when', () => {
    const r = resolveTargets({
      blade: { sizeIn: 9.5 },
      shop: {
        touchPointMm: { band: { min: 36, max: 44 }, setBy: tech, setAt: '2026-11-01T10:00:00Z' },
        heelLiftMm: { band: { min: 18, max: 30 }, setBy: tech, setAt: '2026-11-01T10:00:00Z' },
      },
      skater: { touchPointMm: { band: { min: 38, max: 42 }, setBy: coach, setAt: '2026-11-20T09:00:00Z' } },
      bladePreference: { contactLengthMm: { band: { min: null, max: 4 }, setBy: coach, setAt: '2026-11-21T09:00:00Z' } },
    })
    expect(r.touchPointMm).toMatchObject({ layer: 'skater', band: { min: 38, max: 42 }, setBy: coach })
    expect(r.heelLiftMm).toMatchObject({ layer: 'shop', band: { min: 18, max: 30 }, setAt: '2026-11-01T10:00:00Z' })
    expect(r.contactLengthMm).toMatchObject({ layer: 'blade', band: { min: null, max: 4 } })
    expect(r.rootRadiusSixteenths.layer).toBe('platform')
  })
  it('lets a blade preference win over a skater preference for the same metric', () => {
    const r = resolveTargets({
      blade: { sizeIn: 9.5 },
      skater: { touchPointMm: { band: { min: 38, max: 42 }, setBy: coach, setAt: '2026-11-20T09:00:00Z' } },
      bladePreference: { touchPointMm: { band: { min: 39, max: 43 }, setBy: coach, setAt: '2026-11-22T09:00:00Z' } },
    })
    expect(r.touchPointMm).toMatchObject({ layer: 'blade', band: { min: 39, max: 43 } })
  })
  it('checks bands', () => {
    expect(isValidBand({ min: 35, max: 45 })).toBe(true)
    expect(isValidBand({ min: null, max: 5 })).toBe(true)
    expect(isValidBand({ min: 45, max: 35 })).toBe(false)
    expect(isValidBand({ min: null, max: null })).toBe(false)
    expect(isValidBand({ min: Number.NaN, max: 4 })).toBe(false)
  })
})
