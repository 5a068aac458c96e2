import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CaseCauseList from '~/components/case/CaseCauseList.vue'
import { ranking } from '../../fixtures'

describe('CaseCauseList', () => {
  it('shows the top three causes in words with their probability, and the readings that would sharpen them', async () => {
    const wrapper = await mountSuspended(CaseCauseList, { props: { ranking } })
    const causes = wrapper.findAll('[data-testid="cause"]')
    expect(causes).toHaveLength(3)
    expect(causes[0]!.text()).toContain('Refrigerant leak (undercharge) · Low stage')
    expect(causes[0]!.get('[role="meter"]').attributes('aria-valuenow')).toBe('62')
    expect(causes[0]!.text()).toContain('Standing pressure is 60 % of expected.')
    expect(wrapper.text()).toContain('Low stage: standing pressure (off, equalised)')
    expect(wrapper.text()).toContain('Room (ambient) temperature')
    expect(wrapper.text()).not.toMatch(/refrigerant-leak|standingPressure|ambientTemperature/)
  })

  it('lists every cause on request', async () => {
    const wrapper = await mountSuspended(CaseCauseList, { props: { ranking } })
    await wrapper.get('button').trigger('click')
    expect(wrapper.findAll('[data-testid="cause"]')).toHaveLength(4)
    expect(wrapper.text()).toContain('Something else')
  })
})
