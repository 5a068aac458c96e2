import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CaseReadingForm from '~/components/case/CaseReadingForm.vue'
import { cascadeUnit } from '../../fixtures'

describe('CaseReadingForm', () => {
  it('shows what a typed pressure means and sends it as a reading in the chosen measurement unit', async () => {
    const wrapper = await mountSuspended(CaseReadingForm, { props: { caseId: 901, unit: cascadeUnit, readings: [], busy: false } })
    await wrapper.get('#reading-stage').setValue('low')
    await wrapper.get('#reading-quantity').setValue('suctionPressure')
    await wrapper.get('#reading-unit').setValue('kPa')
    await wrapper.get('#reading-value').setValue('157,41')
    // Ethane saturates at −80 °C under 157.41 kPa absolute (Bücker & Wagner 2006 EOS via CoolProp 8.0.0).
    expect(wrapper.get('#reading-preview').text()).toBe('157 kPa abs → −80.0 °C sat.')
    const options = wrapper.findAll('#reading-stage option').map((o) => o.text())
    expect(options).toEqual(['High stage (R290)', 'Low stage (R170)', 'Unit and room'])
    await wrapper.get('form').trigger('submit')
    const [reading] = wrapper.emitted('submit')![0]!
    expect(reading).toEqual({ quantity: 'suctionPressure', stage: 'low', value: 157.41, unit: 'kPa' })
  })

  it('refuses a value that is not a number with a message, and sends nothing', async () => {
    const wrapper = await mountSuspended(CaseReadingForm, { props: { caseId: 902, unit: cascadeUnit, readings: [], busy: false } })
    await wrapper.get('#reading-value').setValue('twelve')
    expect(wrapper.get('#reading-preview').text()).toContain('Enter a number')
    expect(wrapper.get('button[type="submit"]').attributes('disabled')).toBeDefined()
    await wrapper.get('form').trigger('submit')
    expect(wrapper.emitted('submit')).toBeUndefined()
  })
})
