// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import VChart from 'vue-echarts'
import WearPanel from '../../../src/components/wear/WearPanel.vue'
import { projectWear } from '../../../shared/wear/projection'
import type { BladeHistory, HistoryRow } from '../../../shared/schemas/history'

// Four measurements of an invented blade, the touch point creeping back about 0.4 mm per sharpening.
const measured = [
  { takenAt: '2025-01-10T10:00:00.000Z', sharpeningsSoFar: 0, touchPointMm: 160.1, heelLiftMm: 6.2 },
  { takenAt: '2025-03-02T10:00:00.000Z', sharpeningsSoFar: 2, touchPointMm: 161.0, heelLiftMm: 6.0 },
  { takenAt: '2025-06-20T10:00:00.000Z', sharpeningsSoFar: 3, touchPointMm: 161.3, heelLiftMm: 5.9 },
  { takenAt: '2025-11-05T10:00:00.000Z', sharpeningsSoFar: 5, touchPointMm: 162.1, heelLiftMm: 5.6 },
]
const bands = { touchPointMm: { min: 155, max: 165 }, heelLiftMm: { min: 4, max: 8 } } as const
const history = {
  rows: measured.map((m) => m as unknown as HistoryRow),
  projections: (['touchPointMm', 'heelLiftMm'] as const).map((metric) => ({
    metric, band: bands[metric],
    ...projectWear(measured.map((m) => ({ sharpenings: m.sharpeningsSoFar, value: m[metric] })), bands[metric]),
  })),
  wear: { state: null, reasons: [], heightAfterRestoreMm: null },
  wearRule: 'the rule',
  runnerHeight: { measured: false, minMm: null, shop: null, latest: null, baseline: null, lossStations: [], loss: null },
} as unknown as BladeHistory

type Option = { xAxis: { type: string }; series: { name: string; data: [number, number][]; markArea?: unknown }[] }
const charts = (w: ReturnType<typeof mount>) => w.findAllComponents(VChart).map((c) => ({
  option: c.props('option') as Option, label: c.attributes('aria-label'),
}))

describe('WearPanel', () => {
  it('plots each metric against sharpenings with its trend, then against the date without it', async () => {
    const w = mount(WearPanel, { props: { history } })
    const before = charts(w)
    expect(before).toHaveLength(2)
    const touch = before[0]
    expect(touch.option.xAxis.type).toBe('value')
    expect(touch.option.series[1].data).toEqual(measured.map((m) => [m.sharpeningsSoFar, m.touchPointMm]))
    expect(touch.option.series[0].data).toHaveLength(2)
    expect(touch.option.series[1].markArea).toBeDefined()
    expect(touch.label).toBe('Touch point against sharpenings so far, with its target band and trend')
    expect(w.find('[data-part="date-note"]').exists()).toBe(false)

    const radios = w.findAll('[data-part="wear-axis"] input[type="radio"]')
    expect(radios).toHaveLength(2)
    // Both radios share one name, so the keyboard's arrow keys move between them.
    expect(radios[0].attributes('name')).toBe(radios[1].attributes('name'))
    await radios[1].setValue(true)

    const after = charts(w)[1]
    expect(after.option.xAxis.type).toBe('time')
    expect(after.option.series[1].data).toEqual(measured.map((m) => [Date.parse(m.takenAt), m.heelLiftMm]))
    expect(after.option.series[0].data).toEqual([])
    expect(after.option.series[1].markArea).toBeDefined()
    expect(after.label).toBe('Heel lift against the date measured, with its target band')
    expect(w.findAll('[data-part="date-note"]')).toHaveLength(2)
    expect(w.text()).toContain('The trend line is drawn against sharpenings only')
  })
})
