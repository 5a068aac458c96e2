// A stage refilled with another refrigerant: the unit takes the new fill, the nameplate history keeps
// what it held before, and a case of the unit records the refill in its timeline.
import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { cascadeBody, customerWithSite } from './fixtures'

describe('nameplate history', () => {
  it('records a refill with another refrigerant, warns of the change of safety class, and keeps the history', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId))
    const opened = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Low stage refilled after a leak repair' })

    const refill = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'r-1150', chargeG: 85, basis: 'standing-pressure', note: 'Ethane not in stock', caseId: opened.body.id })
    expect(refill.status).toBe(201)
    expect(refill.body.unit.stages.find((s: { stage: string }) => s.stage === 'low')).toMatchObject({ refrigerant: 'R1150', chargeG: 85 })
    expect(refill.body.history[0]).toMatchObject({ stage: 'low', refrigerant: 'R1150', chargeG: 85, previousRefrigerant: 'R170', previousChargeG: 90, basis: 'standing-pressure', caseId: opened.body.id, by: expect.any(String) })

    // R170 and R1150 are both safety class A3 (ASHRAE 34): nothing to warn of.
    expect(refill.body.warnings).toEqual([])
    const high = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'high', refrigerant: 'R1270', chargeG: 150, basis: 'mass' })
    expect(high.status).toBe(201)
    expect((await tech.get(`/api/units/${unit.id}/nameplate`)).body).toHaveLength(2)
    const events = (await tech.get(`/api/cases/${opened.body.id}`)).body.events
    expect(events.find((e: { type: string }) => e.type === 'nameplate-changed')).toMatchObject({ stage: 'low', refrigerant: 'R1150', previousRefrigerant: 'R170' })
  })

  it('refuses an unknown refrigerant or stage, another organisation, a trainer, and someone signed out', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId))
    const unknown = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R9999', basis: 'mass' })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fieldErrors.refrigerant).toBeDefined()
    expect((await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'single', refrigerant: 'R290', basis: 'mass' })).status).toBe(400)
    expect((await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R290', basis: 'mass', caseId: 999999 })).status).toBe(404)
    expect((await (await signedIn(DEMO.otherTech)).post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R290', basis: 'mass' })).status).toBe(404)
    expect((await (await signedIn(DEMO.otherTech)).get(`/api/units/${unit.id}/nameplate`)).status).toBe(404)
    expect((await (await signedIn(DEMO.trainer)).post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R290', basis: 'mass' })).status).toBe(403)
    expect((await new ApiClient().get(`/api/units/${unit.id}/nameplate`)).status).toBe(401)
  })
})
