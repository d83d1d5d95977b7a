import { describe, expect, it } from 'vitest'
import { attentionFor, type AttentionInput } from '../../../shared/wear/attention'
import type { MetricReading } from '../../../shared/targets/readings'

const reading = (label: string, status: MetricReading['status']) => ({ label, status }) as MetricReading
const calm: AttentionInput = {
  latest: [reading('Touch point', 'on target'), reading('Heel lift', 'on target')],
  wearState: null, projections: [], pair: [], hockeyGrind: false, daysSinceMeasured: 10,
}
const projection = (metric: 'touchPointMm' | 'heelLiftMm', remaining: number | null) =>
  ({ metric, remaining, line: null, nowSharpenings: null, nowValue: null, towards: null })

describe('attentionFor', () => {
  it('leaves a blade on target, recently measured, alone', () => {
    expect(attentionFor(calm)).toEqual({ level: 0, reasons: [] })
  })
  it('puts replace first, then off-target readings and pair differences, then what is coming', () => {
    const a = attentionFor({
      ...calm,
      wearState: 'replace',
      latest: [reading('Touch point', 'off target'), reading('Heel lift', 'near limit')],
      pair: [reading('Touch point, left vs right', 'off target')],
      projections: [projection('heelLiftMm', 2), projection('touchPointMm', 0)],
      hockeyGrind: true,
    })
    expect(a.level).toBe(3)
    expect(a.reasons).toEqual([
      'worn beyond re-profiling: replace',
      'touch point off target',
      'left and right differ: touch point, left vs right',
      'heel lift near its limit',
      'about 2 sharpenings before the heel lift leaves its target',
      'last sharpened with a hockey-range root radius',
    ])
  })
  it('mentions a projection only when two or fewer sharpenings remain, and stale or missing measurements', () => {
    expect(attentionFor({ ...calm, projections: [projection('touchPointMm', 3)] }).level).toBe(0)
    expect(attentionFor({ ...calm, projections: [projection('touchPointMm', 1)] }).reasons).toEqual(['about 1 sharpening before the touch point leaves its target'])
    expect(attentionFor({ ...calm, latest: [], daysSinceMeasured: null })).toEqual({ level: 1, reasons: ['never measured'] })
    expect(attentionFor({ ...calm, daysSinceMeasured: 200.5 }).reasons).toEqual(['not measured for 200 days'])
  })
})
