import { describe, expect, it } from 'vitest'
import { projectWear, theilSen, type WearPoint } from '../../../shared/wear/projection'
import { assessWear, heightAfterRestore } from '../../../shared/wear/state'

/** Touch point moving back 0.4 mm per sharpening from 38 mm, with one wild reading at the fifth sharpening. */
const touchSeries: WearPoint[] = [0, 1, 2, 3, 4, 5, 6].map((n) => ({ sharpenings: n, value: n === 5 ? 50 : 38 + 0.4 * n }))

describe('theilSen', () => {
  it('recovers slope and intercept of a known series despite one wild point', () => {
    // By hand: 15 of the 21 pairwise slopes avoid the wild point and are exactly 0.4; of the 6 through it, 5 are
    // larger and 1 (to x = 6) smaller, so the median (11th) is 0.4; residuals y − 0.4x: 38 six times, 48 once.
    const line = theilSen(touchSeries.map((p) => ({ x: p.sharpenings, y: p.value })))!
    expect(line.slope).toBeCloseTo(0.4, 12)
    expect(line.intercept).toBeCloseTo(38, 12)
    // Ordinary least squares on the same points is pulled by the wild one (slope ≠ 0.4), which is why we do not use it.
    const n = touchSeries.length
    const mx = touchSeries.reduce((s, p) => s + p.sharpenings, 0) / n
    const my = touchSeries.reduce((s, p) => s + p.value, 0) / n
    const sxy = touchSeries.reduce((s, p) => s + (p.sharpenings - mx) * (p.value - my), 0)
    const sxx = touchSeries.reduce((s, p) => s + (p.sharpenings - mx) ** 2, 0)
    expect(Math.abs(sxy / sxx - 0.4)).toBeGreaterThan(0.01)
  })
  it('gives the median of pairwise slopes with an even count', () => {
    // Points (0,0), (1,1), (2,4): slopes 1, 2, 3 → median 2; residuals 0, −1, 0 → intercept 0 (by hand).
    expect(theilSen([{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 4 }])).toEqual({ slope: 2, intercept: 0 })
    // Four points (0,0),(1,1),(2,2),(3,6): slopes 1,1,2,1,2.5,4 → median (1.5 between 1 and 2); by hand.
    expect(theilSen([{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }, { x: 3, y: 6 }])!.slope).toBeCloseTo(1.5, 12)
  })
  it('gives null when every point has the same x', () => {
    expect(theilSen([{ x: 2, y: 1 }, { x: 2, y: 3 }])).toBeNull()
  })
})

describe('projectWear', () => {
  it('projects the sharpenings left before the touch point passes the upper limit', () => {
    // 38 + 0.4x reaches 45 at x = 17.5; now is x = 6, so 11 whole sharpenings stay inside (x = 17 → 44.8 mm).
    const p = projectWear(touchSeries, { min: 35, max: 45 })
    expect(p.towards).toBe('max')
    expect(p.nowValue).toBeCloseTo(40.4, 12)
    expect(p.remaining).toBe(11)
  })
  it('projects a heel lift falling toward the lower limit', () => {
    // 24 − 0.5x reaches 15 at x = 18; now is x = 10, so 8 remain (x = 18 sits exactly on the edge: still inside).
    const series = [2, 4, 6, 8, 10].map((n) => ({ sharpenings: n, value: 24 - 0.5 * n }))
    const p = projectWear(series, { min: 15, max: 35 })
    expect(p.towards).toBe('min')
    expect(p.remaining).toBe(8)
  })
  it('answers 0 when the trend is already outside the band', () => {
    const series = [0, 1, 2, 3].map((n) => ({ sharpenings: n, value: 44 + n }))
    expect(projectWear(series, { min: 35, max: 45 }).remaining).toBe(0)
  })
  it('answers null when the trend never leaves: flat, or heading for an open end', () => {
    const flat = [0, 1, 2, 3].map((n) => ({ sharpenings: n, value: 40 }))
    expect(projectWear(flat, { min: 35, max: 45 })).toMatchObject({ remaining: null, towards: null })
    const shrinking = [0, 1, 2, 3].map((n) => ({ sharpenings: n, value: 4 - 0.3 * n }))
    expect(projectWear(shrinking, { min: null, max: 5 }).remaining).toBeNull()
  })
  it('answers null with fewer than three distinct sharpening counts', () => {
    const two = [{ sharpenings: 0, value: 40 }, { sharpenings: 0, value: 40.2 }, { sharpenings: 1, value: 41 }]
    expect(projectWear(two, { min: 35, max: 45 })).toMatchObject({ line: null, remaining: null })
  })
})

describe('wear state rule', () => {
  const base = { runnerHeightMm: 20, baselineRunnerHeightMm: 21, steelRemovedMm: [0.2, 0.6, null, 0.4], minRunnerHeightMm: 19 }
  it('says nothing while the rocker reads on target and the runner is above the minimum', () => {
    expect(assessWear({ ...base, rockerStatuses: ['on target', 'near limit'] }).state).toBeNull()
  })
  it('says re-profile when the rocker is off target and the runner can spare the steel', () => {
    const a = assessWear({ ...base, rockerStatuses: ['off target', 'on target'] })
    expect(a.state).toBe('re-profile')
    expect(a.heightAfterRestoreMm).toBeCloseTo(20.4, 12) // 21 − the most removed, 0.6
  })
  it('says replace when the runner is at or below the shop minimum, whatever the rocker reads', () => {
    const a = assessWear({ ...base, runnerHeightMm: 19, rockerStatuses: ['on target'] })
    expect(a.state).toBe('replace')
    expect(a.reasons[0]).toContain('minimum')
  })
  it('says replace when restoring the rocker would take the runner to the minimum', () => {
    const a = assessWear({ ...base, steelRemovedMm: [0.5, 2.1], rockerStatuses: ['off target'] })
    expect(heightAfterRestore(21, [0.5, 2.1])).toBeCloseTo(18.9, 12)
    expect(a.state).toBe('replace')
  })
  it('still says re-profile, and asks for a technician, when the runner height is unknown', () => {
    const a = assessWear({ rockerStatuses: ['off target'], runnerHeightMm: null, baselineRunnerHeightMm: null, steelRemovedMm: [], minRunnerHeightMm: 19 })
    expect(a.state).toBe('re-profile')
    expect(a.reasons[0]).toContain('technician')
  })
})
