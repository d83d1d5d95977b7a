import { describe, expect, it } from 'vitest'
import { historyCsv, type HistoryRow } from '../../../shared/schemas/history'
import { overallStatus, rootRadiusOn, sharpeningsAt } from '../../../shared/wear/history'
import type { MetricReading } from '../../../shared/targets/readings'

const s = (sharpenedOn: string, before: string | null = null, after: string | null = null, root: number | null = null) =>
  ({ sharpenedOn, analysisBeforeId: before, analysisAfterId: after, rootRadiusSixteenths: root })

describe('sharpenings so far', () => {
  const list = [s('2026-10-01'), s('2026-10-05', 'a2', null), s('2026-10-09', null, 'a3')]
  it('counts those at registration, those dated on or before the day, and the one linked as "after"', () => {
    expect(sharpeningsAt({ id: 'a1', takenOn: '2026-09-30' }, list, 3)).toBe(3)
    expect(sharpeningsAt({ id: 'a1', takenOn: '2026-10-01' }, list, 3)).toBe(4) // same day counts as after
    expect(sharpeningsAt({ id: 'a2', takenOn: '2026-10-05' }, list, 0)).toBe(1) // linked as "before"
    expect(sharpeningsAt({ id: 'a3', takenOn: '2026-10-08' }, list, 0)).toBe(3) // linked as "after", dated later
  })
  it('finds the root radius of the latest sharpening by a day that recorded one', () => {
    const roots = [s('2026-10-01', null, null, 7), s('2026-10-05'), s('2026-10-09', null, null, 9)]
    expect(rootRadiusOn('2026-09-01', roots)).toBeNull()
    expect(rootRadiusOn('2026-10-06', roots)).toBe(7)
    expect(rootRadiusOn('2026-10-09', roots)).toBe(9)
  })
})

describe('overallStatus', () => {
  const r = (label: string, status: MetricReading['status']) => ({ label, status }) as MetricReading
  it('gives the worst status and names the metrics carrying it', () => {
    expect(overallStatus([r('Touch point', 'on target'), r('Heel lift', 'on target')])).toEqual({ status: 'on target', text: 'on target' })
    expect(overallStatus([r('Touch point', 'near limit'), r('Heel lift', 'off target'), r('Contact length', 'off target')]))
      .toEqual({ status: 'off target', text: 'off target (heel lift, contact length)' })
  })
})

describe('historyCsv', () => {
  it('writes RFC 4180 fields: quotes around commas and quotes, CRLF line ends, formulas defused', () => {
    const row = { takenAt: '2026-10-01T10:00:00.000Z', skater: 'Lee, "Junior"', pair: '=cmd', touchPointMm: 41.23456, rootRadiusSixteenths: null } as unknown as HistoryRow
    const [header, line] = historyCsv([row]).split('\r\n')
    expect(header.startsWith('date,skater,pair,')).toBe(true)
    expect(line.startsWith(`2026-10-01T10:00:00.000Z,"Lee, ""Junior""",'=cmd,`)).toBe(true)
    expect(line).toContain(',41.235,')
    expect(historyCsv([]).endsWith('\r\n')).toBe(true)
  })
})
