// Builders for the equipment API tests. Names and serials carry a random tag so that runs against
// the same database never collide with each other or with the demo data.
import { expect } from 'vitest'
import type { ApiClient } from '../helpers'

export const tag = () => Math.random().toString(36).slice(2, 8).toUpperCase()

/** A new customer with one site (altitude 120 m) of the client's organisation. */
export async function customerWithSite(client: ApiClient, name = `Test customer ${tag()}`) {
  const customer = await client.post('/api/customers', { name, notes: 'Made by the API tests' })
  expect(customer.status).toBe(201)
  const site = await client.post('/api/sites', { customerId: customer.body.id, name: `${name}, Lab`, address: '1 Test Lane', altitudeM: 120 })
  expect(site.status).toBe(201)
  return { customerId: customer.body.id as number, siteId: site.body.id as number, name }
}

/** The body of a valid cascade unit at `siteId`. */
export function cascadeBody(siteId: number, overrides: Record<string, unknown> = {}) {
  return {
    name: `Freezer ${tag()}`,
    model: 'Icebox 9',
    serial: `IB9-${tag()}`,
    kind: 'cascade',
    equipmentClass: 'ult-freezer',
    location: 'Bay 1',
    siteId,
    designCabinetC: -86,
    designCascadeHxC: -35,
    stages: [
      { stage: 'high', refrigerant: 'R290', chargeG: 150, ratedCurrentA: 5.2 },
      { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7.5, referenceStandingPressureKpa: 700, referenceAmbientC: 20, ratedCurrentA: 3.4, designPressureKpa: 2800 },
    ],
    ...overrides,
  }
}

/** The body of a valid single-stage unit at `siteId`. */
export function singleBody(siteId: number, overrides: Record<string, unknown> = {}) {
  return {
    name: `Chest freezer ${tag()}`,
    model: 'Chestline 200',
    serial: `CL2-${tag()}`,
    kind: 'single-stage',
    equipmentClass: 'freezer',
    siteId,
    designCabinetC: -25,
    stages: [{ stage: 'single', refrigerant: 'R600a', chargeG: 60 }],
    ...overrides,
  }
}
