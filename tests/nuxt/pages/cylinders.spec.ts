import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CylindersPage from '~/pages/cylinders.vue'
import type { CylinderDto } from '#shared/types/refrigerant-log'

// Two invented cylinders: one recovery cylinder holding refrigerant of two units, one supply cylinder.
const cylinders: CylinderDto[] = [
  {
    id: 1, label: 'REC-3', refrigerant: 'R170', purpose: 'recovery', note: '', recovered: [{ refrigerant: 'R170', grams: 120 }], charged: [{ refrigerant: 'R170', grams: 30 }],
    netG: 90, units: [{ id: 7, name: 'Freezer Q-17' }, { id: 8, name: 'Freezer Q-18' }], warnings: ['Holds refrigerant recovered from more than one unit.'],
  },
  { id: 2, label: 'SUP-1', refrigerant: 'R290', purpose: 'supply', note: '', recovered: [], charged: [{ refrigerant: 'R290', grams: 148 }], netG: -148, units: [{ id: 7, name: 'Freezer Q-17' }], warnings: [] },
]
registerEndpoint('/api/cylinders', () => cylinders)

describe('the cylinders page', () => {
  it('lists each cylinder with what went into and out of it and links to the units\' logs', async () => {
    const wrapper = await mountSuspended(CylindersPage)
    expect(wrapper.get('h1').text()).toBe('Cylinders')
    const rows = wrapper.findAll('tbody tr').map((r) => r.findAll('td').map((c) => c.text()))
    expect(rows[0]!.slice(0, 4)).toEqual(['REC-3', 'Recovery', '120 g R170', '30 g R170'])
    expect(rows[0]![5]).toBe('Holds refrigerant recovered from more than one unit.')
    expect(rows[1]!.slice(0, 4)).toEqual(['SUP-1', 'Supply', '—', '148 g R290'])
    expect(wrapper.findAll('tbody tr')[0]!.findAll('a').map((a) => a.attributes('href'))).toEqual(['/units/7/refrigerant-log', '/units/8/refrigerant-log'])
  })
})
