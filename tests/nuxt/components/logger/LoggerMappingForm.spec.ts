import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import LoggerMappingForm from '~/components/logger/LoggerMappingForm.vue'
import { LoggerMappingSchema, type LoggerMappingInput } from '#shared/schemas/logger'
import { loggerFile } from './logger-fixtures'

describe('LoggerMappingForm', () => {
  it('fills the suggested mapping of a file with a header and sends columns by name', async () => {
    const wrapper = await mountSuspended(LoggerMappingForm, { props: { file: loggerFile(false), stages: ['high', 'low'], busy: false } })
    expect(wrapper.find('[data-testid="mapping-by-position"]').exists()).toBe(false)
    expect((wrapper.get('#map-time').element as HTMLSelectElement).value).toBe('time')
    expect((wrapper.get('[aria-label="Quantity in Cabinet (°C)"]').element as HTMLSelectElement).value).toBe('cabinetTemperature')
    await wrapper.get('#map-setpoint').setValue('-80')
    await wrapper.get('form').trigger('submit')
    const [mapping, model] = wrapper.emitted('process')![0]! as [LoggerMappingInput, string | null]
    expect(mapping).toMatchObject({ time: { column: 'time' }, columns: [{ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' }], setpointC: -80 })
    expect(mapping.hasHeader).toBeUndefined()
    expect(model).toBeNull()
  })

  it('maps a file without a header row by position, showing each column\'s first value to tell them apart', async () => {
    const wrapper = await mountSuspended(LoggerMappingForm, { props: { file: loggerFile(true), stages: ['high', 'low'], busy: false } })
    expect(wrapper.get('[data-testid="mapping-by-position"]').text()).toMatch(/no header row/)
    await wrapper.get('#map-time').setValue('column 2')
    expect(wrapper.text()).toContain('2026-11-30T08:00:00Z')
    const firstValues = wrapper.findAll('table')[0]!.findAll('tbody tr').map((r) => r.findAll('td')[2]!.text())
    expect(firstValues).toEqual(['21.0', '20.0'])
    await wrapper.get('[aria-label="Use column column 3"]').setValue(true)
    await wrapper.get('[aria-label="Quantity in column 3"]').setValue('cabinetTemperature')
    await wrapper.get('[aria-label="Use column column 1"]').setValue(true)
    await wrapper.get('[aria-label="Quantity in column 1"]').setValue('ambientTemperature')
    await wrapper.get('form').trigger('submit')
    const [mapping] = wrapper.emitted('process')![0]! as [LoggerMappingInput, string | null]
    expect(mapping).toMatchObject({
      hasHeader: false, time: { column: 1 },
      columns: [{ column: 0, quantity: 'ambientTemperature', unit: 'C' }, { column: 2, quantity: 'cabinetTemperature', unit: 'C' }],
    })
    expect(LoggerMappingSchema.safeParse(mapping).success).toBe(true)
  })

  it('asks for at least one column besides the time and sends nothing until then', async () => {
    const wrapper = await mountSuspended(LoggerMappingForm, { props: { file: loggerFile(true), stages: ['single'], busy: false } })
    await wrapper.get('form').trigger('submit')
    expect(wrapper.get('[role="alert"]').text()).toBe('Map at least one column besides the time.')
    expect(wrapper.emitted('process')).toBeUndefined()
  })
})
