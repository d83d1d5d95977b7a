// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import RunnerHeights from '../../../src/components/analysis/RunnerHeights.vue'
import { resultOf } from '../../factories/analysis-results'

describe('RunnerHeights', () => {
  it('shows the lowest runner height and every station where the top edge shows, each with its ±', () => {
    const result = resultOf({ topEdgeAboveLMm: 24 })
    const w = mount(RunnerHeights, { props: { result } })
    const rows = w.findAll('[data-station]')
    expect(rows.map((r) => r.attributes('data-station'))).toEqual(['80', '90', '100', '110', '120', '130', '140', '150', '160'])
    const low = result.runnerHeights!.at(-1)!
    expect(rows.at(-1)!.text()).toBe(`160 mm${low.heightMm.toFixed(2)} ± ${low.plusMinusMm.toFixed(2)} mm`)
    expect(w.text()).toContain(`Lowest: ${low.heightMm.toFixed(2)} ± ${low.plusMinusMm.toFixed(2)} mm at 160 mm behind the base pick`)
  })

  it('says why there is no runner height: the top edge did not show, or the analysis predates it', () => {
    const hidden = mount(RunnerHeights, { props: { result: { ...resultOf(), topEdge: null, runnerHeights: null } } })
    expect(hidden.text()).toContain('does not show clearly between the mounting plates')
    expect(hidden.find('[data-station]').exists()).toBe(false)
    const older = mount(RunnerHeights, { props: { result: resultOf() } })
    expect(older.text()).toContain('measured before the runner\u2019s top edge was traced')
  })
})
