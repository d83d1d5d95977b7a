// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import TargetBandBar from '../../../src/components/targets/TargetBandBar.vue'

const leftPct = (style: string | undefined, prop: 'left' | 'right') => {
  const m = new RegExp(`${prop}:\\s*(?:calc\\(100% - )?([\\d.]+)%`).exec(style ?? '')
  return m ? Number(m[1]) : Number.NaN
}

describe('TargetBandBar', () => {
  it('shows the value with its ± and unit, the status word and the band, and says all of it in its label', () => {
    const w = mount(TargetBandBar, {
      props: { label: 'Touch point', value: 41.23, plusMinus: 1.5, band: { min: 35, max: 45 }, unit: 'mm' },
    })
    expect(w.get('[data-part="value"]').text()).toBe('41.2 ± 1.5 mm')
    expect(w.get('[data-part="status"]').text()).toBe('on target')
    expect(w.get('[data-part="target"]').text()).toBe('target 35–45 mm')
    expect(w.attributes('role')).toBe('img')
    expect(w.attributes('aria-label')).toBe('Touch point 41.2 ± 1.5 mm, target 35–45 mm: on target')
  })

  it('places the marker inside the shaded band, its whisker spanning the ±', () => {
    const w = mount(TargetBandBar, { props: { value: 40, plusMinus: 2, band: { min: 35, max: 45 }, unit: 'mm' } })
    // The domain is the band with half its width either side: 30–50 mm, so 35 → 25 %, 45 → 75 %, 40 → 50 %.
    const band = w.get('[data-part="band"]').attributes('style')
    expect(leftPct(band, 'left')).toBeCloseTo(25, 3)
    expect(leftPct(band, 'right')).toBeCloseTo(75, 3)
    expect(leftPct(w.get('[data-part="marker"]').attributes('style'), 'left')).toBeCloseTo(50, 3)
    const whisker = w.get('[data-part="whisker"]').attributes('style')
    expect(leftPct(whisker, 'left')).toBeCloseTo(40, 3) // 38 mm
    expect(leftPct(whisker, 'right')).toBeCloseTo(60, 3) // 42 mm
  })

  it('reads near limit and off target from the value and ±, and widens the axis to show a far value', () => {
    const near = mount(TargetBandBar, { props: { value: 44.2, plusMinus: 1, band: { min: 35, max: 45 }, unit: 'mm' } })
    expect(near.get('[data-part="status"]').text()).toBe('near limit')
    const off = mount(TargetBandBar, { props: { value: 60, band: { min: 35, max: 45 }, unit: 'mm' } })
    expect(off.get('[data-part="status"]').text()).toBe('off target')
    const marker = leftPct(off.get('[data-part="marker"]').attributes('style'), 'left')
    expect(marker).toBeGreaterThan(75)
    expect(marker).toBeLessThanOrEqual(100)
  })

  it('draws a one-sided band from zero and writes it as "under"', () => {
    const w = mount(TargetBandBar, { props: { label: 'Contact length', value: 3.1, plusMinus: 0.2, band: { min: null, max: 5 }, unit: 'mm' } })
    expect(w.get('[data-part="target"]').text()).toBe('target under 5 mm')
    expect(leftPct(w.get('[data-part="band"]').attributes('style'), 'left')).toBeCloseTo(0, 3)
    expect(w.attributes('aria-label')).toBe('Contact length 3.1 ± 0.2 mm, target under 5 mm: on target')
  })

  it('carries status in words, never in a status colour class', () => {
    const w = mount(TargetBandBar, { props: { value: 60, band: { min: 35, max: 45 }, unit: 'mm' } })
    expect(w.html()).not.toMatch(/success|warning|error|green|amber|red/i)
  })

  it('says when nothing was measured, with no marker', () => {
    const w = mount(TargetBandBar, { props: { label: 'Heel lift', value: null, band: { min: 15, max: 35 }, unit: 'mm' } })
    expect(w.find('[data-part="marker"]').exists()).toBe(false)
    expect(w.attributes('aria-label')).toBe('Heel lift not measured, target 15–35 mm')
  })

  it('takes a status computed elsewhere and writes sixteenths as a fraction', () => {
    const w = mount(TargetBandBar, {
      props: { value: 7, band: { min: 5, max: 8 }, unit: '/16 in', decimals: 0, status: 'near limit' },
    })
    expect(w.get('[data-part="value"]').text()).toBe('7/16 in')
    expect(w.get('[data-part="status"]').text()).toBe('near limit')
  })
})
