import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CaseCloseForm from '~/components/case/CaseCloseForm.vue'
import { cascadeUnit, ranking } from '../../fixtures'

registerEndpoint('/api/diagnosis/titles', () => ({ causes: {}, tests: {}, outcomes: {} }))

describe('CaseCloseForm', () => {
  it('starts from the top cause and names each problem by its field in words', async () => {
    const wrapper = await mountSuspended(CaseCloseForm, { props: { unit: cascadeUnit, ranking, busy: false } })
    expect((wrapper.get('#close-cause').element as HTMLSelectElement).value).toBe('refrigerant-leak')
    expect(wrapper.get('#close-cause option[value="refrigerant-leak"]').text()).toBe('Refrigerant leak (undercharge)')
    await wrapper.get('#close-work').setValue('Brazed the drier flare, pressure tested with nitrogen, recharged by weight.')
    await wrapper.findAll('button').find((b) => b.text() === 'Add refrigerant line')!.trigger('click')
    await wrapper.get('#tx-grams-0').setValue('-5')
    await wrapper.get('form').trigger('submit')
    expect(wrapper.get('[role="alert"]').text()).toContain('Refrigerant added or recovered, line 1: grams must be more than 0')
    expect(wrapper.emitted('close')).toBeUndefined()

    await wrapper.get('#tx-grams-0').setValue('205,5')
    await wrapper.get('form').trigger('submit')
    const [body] = wrapper.emitted('close')![0] as [{ refrigerantTransactions: { grams: number; refrigerant: string }[] }]
    expect(body.refrigerantTransactions).toEqual([expect.objectContaining({ grams: 205.5, refrigerant: 'R170', stage: 'low' })])
  })
})
