// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import { nextTick } from 'vue'
import HollowView from '../../../src/views/HollowView.vue'

describe('HollowView', () => {
  it('lists every round coin with the sixteenth it checks', () => {
    const w = mount(HollowView)
    expect(w.findAll('tbody tr')).toHaveLength(22)
    // United States Mint: 1¢ is 19.05 mm, radius 9.525 mm = exactly 6/16 in (REFERENCES.md).
    const penny = w.get('[data-coin="us-1c"]').text()
    expect(penny).toContain('19.05 mm')
    expect(penny).toContain('6/16 in')
    expect(penny).toContain('0.00 mm')
  })

  it('computes the hollow depth for the default 7/16 in on a 4.0 mm runner and flags no hockey grind', () => {
    const w = mount(HollowView)
    // R − √(R² − 2²) with R = 11.1125 mm (REFERENCES.md formula; computed): 0.1815 mm.
    expect(w.get('[data-out="depth"]').text()).toContain('0.181 mm')
    expect(w.find('[data-out="hockey"]').exists()).toBe(false)
    expect(w.get('[data-out="coins"]').text()).toContain('US 5¢')
  })

  it('flags 9/16 in as a hockey grind and reads it off target against 5/16–8/16 in', async () => {
    const w = mount(HollowView)
    const input = w.get('[data-field="sixteenths"] input')
    await input.setValue('9')
    await input.trigger('blur')
    await nextTick()
    expect(w.get('[data-out="hockey"]').text()).toContain('hockey grind')
    expect(w.get('[role="img"]').attributes('aria-label')).toBe('Root radius 9/16 in, target 5/16–8/16 in: off target')
  })
})
