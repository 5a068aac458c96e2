import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it, vi } from 'vitest'
import CaseNextTest from '~/components/case/CaseNextTest.vue'
import { ranking } from '../../fixtures'

registerEndpoint('/api/diagnosis/titles', () => ({ causes: {}, tests: {}, outcomes: {} }))
registerEndpoint('/api/diagnosis/tests', () => [{
  test: 'standing-pressure-check', title: 'Standing pressure check', minutes: 20, opensSystem: false, hotWork: false, stages: ['high', 'low', 'single'],
  safetyNotes: [], procedure: '1. Stop the stage.\n2. Read the gauge.', outcomes: [{ outcome: 'low', label: 'Below the expected pressure' }, { outcome: 'as-expected', label: 'As expected' }],
}])

describe('CaseNextTest', () => {
  it('proposes the best test in words and records an outcome for its stage', async () => {
    const wrapper = await mountSuspended(CaseNextTest, { props: { ranking, refrigerants: ['R290', 'R170'], readOnly: false } })
    expect(wrapper.get('[data-testid="next-test-title"]').text()).toBe('Standing pressure check · Low stage')
    expect(wrapper.text()).toContain('20 min')
    expect(wrapper.get('[data-testid="next-test-value"]').text()).toBe('Settles a leak against a blockage on the low stage.')
    expect(wrapper.text()).not.toContain('bit')
    const button = await vi.waitFor(() => {
      const found = wrapper.findAll('button').find((b) => b.text() === 'Below the expected pressure')
      if (!found) throw new Error('outcome buttons not shown yet')
      return found
    })
    await button.trigger('click')
    expect(wrapper.emitted('record')![0]).toEqual(['standing-pressure-check', 'low', 'low'])
  })
})
