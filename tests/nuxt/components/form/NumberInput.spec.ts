import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import NumberInput from '~/components/form/NumberInput.vue'
import CalculatorNumberField from '~/components/calculator/CalculatorNumberField.vue'
import EquipmentField from '~/components/equipment/EquipmentField.vue'
import CaseReadingForm from '~/components/case/CaseReadingForm.vue'
import { cascadeUnit } from '../../fixtures'

describe('FormNumberInput', () => {
  it('opens the decimal keypad and flips the sign of what is typed with its ± key', async () => {
    const wrapper = await mountSuspended(NumberInput, { props: { id: 'n', signed: true, modelValue: '80' } })
    const input = wrapper.get('input')
    expect(input.attributes('inputmode')).toBe('decimal')
    expect(input.attributes('type')).toBe('text')
    const sign = wrapper.get('button[aria-label="Change sign"]')
    expect(sign.attributes('aria-controls')).toBe('n')
    await sign.trigger('click')
    expect(wrapper.emitted('update:modelValue')!.at(-1)).toEqual(['-80'])
    await wrapper.setProps({ modelValue: '−80' })
    await sign.trigger('click')
    expect(wrapper.emitted('update:modelValue')!.at(-1)).toEqual(['80'])
    await wrapper.setProps({ modelValue: '' })
    await sign.trigger('click')
    expect(wrapper.emitted('update:modelValue')!.at(-1)).toEqual(['-'])
  })

  it('has no ± key for a quantity that cannot be negative, and passes aria attributes to the input', async () => {
    const wrapper = await mountSuspended(NumberInput, { props: { id: 'g', modelValue: '' }, attrs: { 'aria-invalid': 'true', 'aria-describedby': 'g-error' } })
    expect(wrapper.find('button').exists()).toBe(false)
    expect(wrapper.get('input').attributes('aria-describedby')).toBe('g-error')
    expect(wrapper.get('input').attributes('aria-invalid')).toBe('true')
  })

  it('is the input of the calculator fields and the numeric register fields', async () => {
    const calc = await mountSuspended(CalculatorNumberField, { props: { id: 'amb', label: 'Ambient (°C)', signed: true, modelValue: '20' } })
    await calc.get('button[aria-label="Change sign"]').trigger('click')
    expect(calc.emitted('update:modelValue')!.at(-1)).toEqual(['-20'])
    const field = await mountSuspended(EquipmentField, { props: { id: 'cab', label: 'Cabinet', numeric: true, signed: true, unit: '°C', modelValue: '86' } })
    expect(field.get('input').attributes('inputmode')).toBe('decimal')
    await field.get('button[aria-label="Change sign"]').trigger('click')
    expect(field.emitted('update:modelValue')!.at(-1)).toEqual(['-86'])
    const text = await mountSuspended(EquipmentField, { props: { id: 'nm', label: 'Name', modelValue: '' } })
    expect(text.find('button').exists()).toBe(false)
    expect(text.get('input').attributes('inputmode')).toBeUndefined()
  })
})

describe('the reading form value', () => {
  it('offers the ± key for temperatures and gauge pressures, not for absolute pressures or currents', async () => {
    const wrapper = await mountSuspended(CaseReadingForm, { props: { caseId: 903, unit: cascadeUnit, readings: [], busy: false } })
    await wrapper.get('#reading-stage').setValue('unit')
    await wrapper.get('#reading-quantity').setValue('cabinetTemperature')
    await wrapper.get('#reading-value').setValue('80')
    await wrapper.get('button[aria-label="Change sign"]').trigger('click')
    expect((wrapper.get('#reading-value').element as HTMLInputElement).value).toBe('-80')
    await wrapper.get('form').trigger('submit')
    expect(wrapper.emitted('submit')![0]![0]).toEqual({ quantity: 'cabinetTemperature', value: -80, unit: 'C' })

    await wrapper.get('#reading-stage').setValue('low')
    await wrapper.get('#reading-quantity').setValue('suctionPressure')
    await wrapper.get('#reading-unit').setValue('psig')
    expect(wrapper.find('button[aria-label="Change sign"]').exists()).toBe(true)
    await wrapper.get('#reading-unit').setValue('kPa')
    expect(wrapper.find('button[aria-label="Change sign"]').exists()).toBe(false)
  })
})
