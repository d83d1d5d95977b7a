// @vitest-environment happy-dom
import { mount, RouterLinkStub } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import AttentionList from '../../../src/components/home/AttentionList.vue'
import type { AttentionItem } from '../../../shared/schemas/attention'

const item = (over: Partial<AttentionItem>): AttentionItem => ({
  bladeId: '00000000-0000-4000-8000-000000000001', pairId: '00000000-0000-4000-8000-000000000002',
  skaterId: '00000000-0000-4000-8000-000000000003', skater: 'Ada', pair: 'Show skates', side: 'left',
  level: 2, reasons: ['needs a re-profile', 'touch point off target'], lastMeasuredAt: null, ...over,
})

describe('AttentionList', () => {
  it('lists each blade with its urgency in words and its reasons, linking to the blade', () => {
    const w = mount(AttentionList, {
      props: { items: [item({}), item({ bladeId: '00000000-0000-4000-8000-000000000009', level: 1, side: 'right', reasons: ['never measured'] })], loading: false },
      global: { stubs: { RouterLink: RouterLinkStub } },
    })
    const rows = w.findAll('li')
    expect(rows).toHaveLength(2)
    expect(rows[0].text()).toContain('Ada · Show skates · left')
    expect(rows[0].text()).toContain('act now')
    expect(rows[0].text()).toContain('needs a re-profile; touch point off target')
    expect(rows[1].text()).toContain('keep an eye on')
    expect(w.findAllComponents(RouterLinkStub)[0].props('to')).toBe('/blades/00000000-0000-4000-8000-000000000001')
    expect(w.html()).not.toMatch(/success|warning|error/)
  })
  it('says so when nothing needs attention', () => {
    const w = mount(AttentionList, { props: { items: [], loading: false }, global: { stubs: { RouterLink: RouterLinkStub } } })
    expect(w.text()).toContain('Nothing needs attention')
  })
})
