import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { cascadeBody, customerWithSite, singleBody } from './fixtures'

const errorsOf = (res: { body: { data?: { fieldErrors?: Record<string, string[]> } } }) => res.body.data?.fieldErrors ?? {}

describe('units: create and edit', () => {
  it('creates a cascade unit with two stages and a single-stage unit', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId, name: customer } = await customerWithSite(tech)
    const body = cascadeBody(siteId)
    const cascade = await tech.post('/api/units', body)
    expect(cascade.status).toBe(201)
    expect(cascade.body).toMatchObject({ id: expect.any(Number), name: body.name, kind: 'cascade', customer, siteId, design: { cabinetC: -86, cascadeHxC: -35 } })
    expect(cascade.body.stages).toEqual([
      { stage: 'high', refrigerant: 'R290', chargeG: 150, volumeL: null, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 5.2, designPressureKpa: null, meteringDevice: null },
      { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7.5, referenceStandingPressureKpa: 700, referenceAmbientC: 20, ratedCurrentA: 3.4, designPressureKpa: 2800, meteringDevice: null },
    ])

    const single = await tech.post('/api/units', singleBody(siteId, { stages: [{ stage: 'single', refrigerant: 'r-600a', chargeG: 60 }] }))
    expect(single.status).toBe(201)
    expect(single.body).toMatchObject({ kind: 'single-stage', location: '', design: { cabinetC: -25, cascadeHxC: null } })
    expect(single.body.stages).toEqual([expect.objectContaining({ stage: 'single', refrigerant: 'R600a', chargeG: 60 })])
    expect((await tech.get(`/api/units/${single.body.id}`)).body.name).toBe(single.body.name)
  })

  it('edits fields and replaces the stages, keeping what the patch does not mention', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId))
    const moved = await tech.patch(`/api/units/${unit.id}`, { location: 'Bay 7' })
    expect(moved.status).toBe(200)
    expect(moved.body).toMatchObject({ location: 'Bay 7', serial: unit.serial, stages: unit.stages })

    const converted = await tech.patch(`/api/units/${unit.id}`, { kind: 'single-stage', equipmentClass: 'freezer', stages: [{ stage: 'single', refrigerant: 'R290', chargeG: 140 }] })
    expect(converted.status).toBe(200)
    expect(converted.body).toMatchObject({ kind: 'single-stage', design: { cabinetC: -86, cascadeHxC: null } })
    expect(converted.body.stages.map((s: { stage: string }) => s.stage)).toEqual(['single'])
  })

  it('answers 400 with field errors for bad input and keeps the saved unit', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: saved } = await tech.post('/api/units', cascadeBody(siteId))
    const [high, low] = cascadeBody(siteId).stages as Record<string, unknown>[]
    const cases: [string, Record<string, unknown>, string][] = [
      ['unknown refrigerant', cascadeBody(siteId, { stages: [{ ...high, refrigerant: 'R999' }, low] }), 'stages.0.refrigerant'],
      ['cascade without a low stage', cascadeBody(siteId, { stages: [high] }), 'stages'],
      ['pressure without ambient', cascadeBody(siteId, { stages: [high, { ...low, referenceAmbientC: null }] }), 'stages.1.referenceAmbientC'],
      ['negative charge', cascadeBody(siteId, { stages: [{ ...high, chargeG: -5 }, low] }), 'stages.0.chargeG'],
      ['volume below 0.1 L', cascadeBody(siteId, { stages: [high, { ...low, volumeL: 0 }] }), 'stages.1.volumeL'],
      ['cabinet colder than -150 °C', cascadeBody(siteId, { designCabinetC: -200 }), 'designCabinetC'],
      ['cascade heat exchanger on a single-stage unit', singleBody(siteId, { designCascadeHxC: -30 }), 'designCascadeHxC'],
      ['single-stage unit with a high stage', singleBody(siteId, { stages: [high] }), 'stages'],
      ['no serial', cascadeBody(siteId, { serial: '' }), 'serial'],
      ['text for a number', cascadeBody(siteId, { designCabinetC: '-80' }), 'designCabinetC'],
    ]
    for (const [what, body, field] of cases) {
      const res = await tech.post('/api/units', body)
      expect(res.status, what).toBe(400)
      expect(Object.keys(errorsOf(res)), what).toContain(field)
    }
    const badPatch = await tech.patch(`/api/units/${saved.id}`, { stages: [high] })
    expect(badPatch.status).toBe(400)
    expect(errorsOf(badPatch).stages).toBeDefined()
    expect((await tech.patch(`/api/units/${saved.id}`, { kind: 'single-stage' })).status).toBe(400)
    expect((await tech.get(`/api/units/${saved.id}`)).body).toEqual(saved)
  })

  it("keeps each stage's metering device, and a case of the unit leaves out the other device's faults and tests", async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const bad = await tech.post('/api/units', singleBody(siteId, { stages: [{ stage: 'single', refrigerant: 'R290', chargeG: 145, meteringDevice: 'orifice' }] }))
    expect(bad.status).toBe(400)
    expect(errorsOf(bad)['stages.0.meteringDevice']).toBeDefined()

    const made = await tech.post('/api/units', singleBody(siteId, { stages: [{ stage: 'single', refrigerant: 'R290', chargeG: 145, ratedCurrentA: 2.3, meteringDevice: 'capillary' }] }))
    expect(made.status).toBe(201)
    expect(made.body.stages[0]).toMatchObject({ meteringDevice: 'capillary' })
    expect((await tech.get(`/api/units/${made.body.id}`)).body.stages[0].meteringDevice).toBe('capillary')

    // A starved capillary freezer: on a capillary-fed stage neither valve fault is weighed, nor the valve check proposed.
    const opened = await tech.post('/api/cases', { unitId: made.body.id, complaint: 'Freezer warm, compressor runs all the time' })
    const ranked = await tech.post(`/api/cases/${opened.body.id}/readings`, {
      readings: [
        { quantity: 'cabinetTemperature', value: -8, unit: 'C' },
        { quantity: 'ambientTemperature', value: 23, unit: 'C' },
        { quantity: 'compressorRunning', stage: 'single', value: true, unit: 'bool' },
        { quantity: 'compressorCurrent', stage: 'single', value: 1.6, unit: 'A' },
      ],
    })
    expect(ranked.status).toBe(200)
    const causes = ranked.body.ranking.causes.map((c: { cause: string }) => c.cause)
    expect(causes).not.toContain('expansion-valve-underfeeding')
    expect(causes).not.toContain('expansion-valve-overfeeding')
    expect(ranked.body.ranking.tests.map((t: { test: string }) => t.test)).not.toContain('expansion-valve-check')

    // Cleared with null: not recorded again.
    const cleared = await tech.patch(`/api/units/${made.body.id}`, { stages: [{ stage: 'single', refrigerant: 'R290', chargeG: 145, meteringDevice: null }] })
    expect(cleared.status).toBe(200)
    expect(cleared.body.stages[0].meteringDevice).toBeNull()
  })

  it('refuses a serial already on the register with 409 and a field error', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const first = await tech.post('/api/units', cascadeBody(siteId))
    const again = await tech.post('/api/units', cascadeBody(siteId, { serial: first.body.serial.toLowerCase() }))
    expect(again.status).toBe(409)
    expect(errorsOf(again).serial).toEqual(['This serial number is already on your register'])
    const other = await tech.post('/api/units', singleBody(siteId))
    expect((await tech.patch(`/api/units/${other.body.id}`, { serial: first.body.serial })).status).toBe(409)
    expect((await tech.patch(`/api/units/${first.body.id}`, { serial: first.body.serial })).status).toBe(200)

    // Serials are unique per organisation, not across them.
    const bluefen = await signedIn(DEMO.otherTech)
    const [theirSite] = (await bluefen.get('/api/sites')).body
    expect((await bluefen.post('/api/units', singleBody(theirSite.id, { serial: first.body.serial }))).status).toBe(201)
  })

  it('answers 401 signed out, 403 to a trainer, 404 for another organisation\'s unit or site', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId))
    expect((await new ApiClient().post('/api/units', cascadeBody(siteId))).status).toBe(401)

    const trainer = await signedIn(DEMO.trainer)
    expect((await trainer.get(`/api/units/${unit.id}`)).status).toBe(200)
    expect((await trainer.post('/api/units', cascadeBody(siteId))).status).toBe(403)
    expect((await trainer.patch(`/api/units/${unit.id}`, { name: 'Renamed' })).status).toBe(403)

    const other = await signedIn(DEMO.otherTech)
    expect((await other.get(`/api/units/${unit.id}`)).status).toBe(404)
    expect((await other.get(`/api/units/${unit.id}/overview`)).status).toBe(404)
    expect((await other.patch(`/api/units/${unit.id}`, { name: 'Mine now' })).status).toBe(404)
    const foreignSite = await other.post('/api/units', singleBody(siteId))
    expect(foreignSite.status).toBe(404)
    expect(errorsOf(foreignSite).siteId).toEqual(['Site not found'])
    expect((await tech.patch(`/api/units/${unit.id}`, { siteId: 99999999 })).status).toBe(404)
    expect((await tech.get(`/api/units/${unit.id}`)).body).toEqual(unit)
  })

  it('keeps GET /api/units a plain array in the contract shape, new units included', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId))
    const list = await tech.get('/api/units')
    expect(Array.isArray(list.body)).toBe(true)
    const found = list.body.find((u: { id: number }) => u.id === unit.id)
    expect(Object.keys(found)).toEqual(expect.arrayContaining(['id', 'name', 'kind', 'customer', 'site', 'stages']))
    expect(typeof found.customer).toBe('string')
    expect(found.stages.map((s: Record<string, unknown>) => [s.stage, s.refrigerant, s.chargeG, s.volumeL])).toEqual([['high', 'R290', 150, null], ['low', 'R170', 90, 7.5]])
  })
})
