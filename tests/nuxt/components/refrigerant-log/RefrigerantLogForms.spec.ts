import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import RefrigerantLogCheckForm from '~/components/refrigerant-log/RefrigerantLogCheckForm.vue'
import RefrigerantLogLineForm from '~/components/refrigerant-log/RefrigerantLogLineForm.vue'
import RefrigerantLogSettings from '~/components/refrigerant-log/RefrigerantLogSettings.vue'
import type { UnitComplianceSettingsDto } from '#shared/types/refrigerant-log'
import { cascadeUnit } from '../../fixtures'

// The log's answer is echoed back as the "saved" event; its content does not matter here.
const posted: { path: string; body: unknown }[] = []
for (const path of ['/api/units/7/refrigerant-log', '/api/units/7/compliance-checks', '/api/units/7/compliance-settings']) {
  registerEndpoint(path, { method: path.endsWith('settings') ? 'PUT' : 'POST', handler: async (event) => {
    const { readBody } = await import('h3')
    posted.push({ path, body: await readBody(event) })
    return { unitId: 7, echoed: path }
  } })
}

/** Option texts longer than this do not fit a half-width select on a 390 px phone (about 150 px at 16 px type). */
const HALF_WIDTH_CHARS = 18

describe('RefrigerantLogLineForm', () => {
  it('offers short purposes with the long explanation beside the select, and posts the line', async () => {
    const wrapper = await mountSuspended(RefrigerantLogLineForm, { props: { unitId: 7, stages: cascadeUnit.stages } })
    const purposes = wrapper.findAll('#line-purpose option').map((o) => o.text())
    expect(purposes[0]).toBe('Not said')
    for (const text of purposes) expect(text.length, text).toBeLessThanOrEqual(HALF_WIDTH_CHARS)
    expect(wrapper.get('#line-purpose-hint').text()).toMatch(/what was recovered for the work counts as put back first/)
    await wrapper.get('#line-purpose').setValue('recharge')
    expect(wrapper.get('#line-purpose-hint').text()).toBe('Recharge after a repair (what was recovered is put back first)')

    await wrapper.get('#line-stage').setValue('low')
    expect((wrapper.get('#line-refrigerant').element as HTMLInputElement).value).toBe('R170')
    await wrapper.get('#line-grams').setValue('45,5')
    await wrapper.get('#line-cylinder').setValue('SUP-07')
    await wrapper.get('form').trigger('submit')
    await new Promise((r) => setTimeout(r, 50))
    expect(posted.at(-1)).toEqual({ path: '/api/units/7/refrigerant-log', body: { stage: 'low', refrigerant: 'R170', grams: 45.5, direction: 'added', cylinder: 'SUP-07', purpose: 'recharge' } })
    expect(wrapper.emitted('saved')).toHaveLength(1)
  })

  it('names what is wrong and posts nothing when the grams are not a number', async () => {
    const before = posted.length
    const wrapper = await mountSuspended(RefrigerantLogLineForm, { props: { unitId: 7, stages: cascadeUnit.stages } })
    await wrapper.get('#line-grams').setValue('lots')
    await wrapper.get('form').trigger('submit')
    expect(wrapper.get('[role="alert"]').text()).not.toBe('')
    expect(posted.length).toBe(before)
    expect(wrapper.emitted('saved')).toBeUndefined()
  })
})

describe('RefrigerantLogCheckForm', () => {
  it('says passed or failed in one word and explains it beside the select', async () => {
    const wrapper = await mountSuspended(RefrigerantLogCheckForm, { props: { unitId: 7, stages: cascadeUnit.stages } })
    expect(wrapper.findAll('#check-passed option').map((o) => o.text())).toEqual(['Passed', 'Failed'])
    expect(wrapper.get('#check-passed-hint').text()).toBe('No leak found, or the test held.')
    await wrapper.get('#check-passed').setValue('false')
    expect(wrapper.get('#check-passed-hint').text()).toBe('A leak was found or the test failed.')
    await wrapper.get('#check-kind').setValue('repair')
    await wrapper.get('#check-stage').setValue('low')
    await wrapper.get('form').trigger('submit')
    await new Promise((r) => setTimeout(r, 50))
    expect(posted.at(-1)).toEqual({ path: '/api/units/7/compliance-checks', body: { kind: 'repair', passed: false, stage: 'low' } })
  })
})

describe('RefrigerantLogSettings', () => {
  it('lists appliance types in short words and spells out the chosen one below', async () => {
    const settings: UnitComplianceSettingsDto = { applianceType: 'other', hermeticallySealed: false, leakDetectionSystem: false }
    const wrapper = await mountSuspended(RefrigerantLogSettings, { props: { unitId: 7, settings, canEdit: true } })
    const options = wrapper.findAll('#appliance-type option').map((o) => o.text())
    expect(options).toContain('Other (lab, test equipment)')
    for (const text of options) expect(text.length, text).toBeLessThanOrEqual(28)
    expect(wrapper.text()).toContain('Other appliances (e.g. lab and test equipment)')
    await wrapper.get('#appliance-type').setValue('commercial-refrigeration')
    expect(wrapper.text()).toContain('Commercial refrigeration (retail food, cold storage)')
  })
})
