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

    // R170 and R1150 are both safety class A3 (ASHRAE 34): no change of class to warn of; only that the
    // reference standing pressure of the old fill (700 kPa abs at 20 °C) was cleared.
    expect(refill.body.warnings).toHaveLength(1)
    expect(refill.body.warnings[0]).toMatch(/^The reference standing pressure on record \(700 kPa abs at 20\.0 °C\) was taken with the previous fill/)
    const high = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'high', refrigerant: 'R1270', chargeG: 150, basis: 'mass' })
    expect(high.status).toBe(201)
    expect((await tech.get(`/api/units/${unit.id}/nameplate`)).body).toHaveLength(2)
    const events = (await tech.get(`/api/cases/${opened.body.id}`)).body.events
    expect(events.find((e: { type: string }) => e.type === 'nameplate-changed')).toMatchObject({ stage: 'low', refrigerant: 'R1150', previousRefrigerant: 'R170' })
  })

  it('keeps a substitution plan chosen in the planner on the unit and in the case, with its figures; a closed case takes none', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const stages = [
      { stage: 'high', refrigerant: 'R290', chargeG: 150 },
      { stage: 'low', refrigerant: 'R13', chargeG: 600, volumeL: 12, designPressureKpa: 2600 },
    ]
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId, { stages }))
    const opened = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Low stage empty; no R13 to be had' })
    // 153.8 g of R1150 stands where 600 g of R13 stands in 12 L at 22 °C: R13 (Platzer 1990) and R1150 (Smukala 2000) EOS via CoolProp 8.0.0.
    const plan = await tech.post('/api/calculations/substitution', { volumeL: 12, ambientC: 22, from: { designation: 'R13', chargeG: 600 }, to: 'R1150', basis: 'standing-pressure', unit: 'psig', designPressureKpa: 2600 })
    expect(plan.status).toBe(200)
    expect(plan.body.chargeG).toBeCloseTo(153.8, 1)
    const note = `Same standing pressure plan for 12 L: 154 g of R1150 for the nameplate 600 g of R13; charge to ${plan.body.chargeTo.text} at 22.0 °C room.`
    const saved = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R1150', chargeG: 153.8, basis: plan.body.basis, note, caseId: opened.body.id })
    expect(saved.status).toBe(201)
    expect(saved.body.unit.stages.find((s: { stage: string }) => s.stage === 'low')).toMatchObject({ refrigerant: 'R1150', chargeG: 153.8, volumeL: 12, designPressureKpa: 2600 })
    expect(saved.body.history[0]).toMatchObject({ refrigerant: 'R1150', previousRefrigerant: 'R13', previousChargeG: 600, basis: 'standing-pressure', note, caseId: opened.body.id, by: expect.any(String), at: expect.any(String) })
    // R13 is A1 and R1150 A3 (ASHRAE 34): the change of safety class is said on saving.
    expect(saved.body.warnings.join(' ')).toMatch(/from A1 to A3/)
    const { events } = (await tech.get(`/api/cases/${opened.body.id}`)).body
    expect(events.find((e: { type: string }) => e.type === 'nameplate-changed')).toMatchObject({ basis: 'standing-pressure', note, refrigerant: 'R1150', chargeG: 153.8, by: expect.anything() })

    // A trainer may neither change the unit nor add to the case.
    expect((await (await signedIn(DEMO.trainer)).post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R170', basis: 'mass', caseId: opened.body.id })).status).toBe(403)
    // An engineer works cases and edits units: allowed.
    const engineer = await (await signedIn(DEMO.engineer)).post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R170', chargeG: 150, basis: 'mass', caseId: opened.body.id })
    expect(engineer.status).toBe(201)

    const closed = await tech.post(`/api/cases/${opened.body.id}/close`, { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], workDone: 'Refilled the low stage.' })
    expect(closed.status).toBe(200)
    const late = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R1150', chargeG: 153.8, basis: 'standing-pressure', caseId: opened.body.id })
    expect(late.status).toBe(409)
    // Refused: nothing changed on the unit or in its history.
    expect((await tech.get(`/api/units/${unit.id}/nameplate`)).body).toHaveLength(2)
    expect((await tech.get(`/api/units/${unit.id}`)).body.stages.find((s: { stage: string }) => s.stage === 'low')).toMatchObject({ refrigerant: 'R170', chargeG: 150 })
  })

  it("makes the standing pressure given with a refill the stage's reference, and clears a reference the old fill left", async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const stages = [
      { stage: 'high', refrigerant: 'R290', chargeG: 150 },
      // A reference deliberately apart from what the charge gives, so the test can tell which was used.
      { stage: 'low', refrigerant: 'R13', chargeG: 600, volumeL: 12, referenceStandingPressureKpa: 900, referenceAmbientC: 22, designPressureKpa: 2600 },
    ]
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId, { stages }))
    const opened = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Low stage refilled with ethylene' })
    const standingAt22 = async (kpa: number) => {
      const res = await tech.post(`/api/cases/${opened.body.id}/readings`, {
        readings: [{ quantity: 'standingPressure', stage: 'low', value: kpa, unit: 'kPa' }, { quantity: 'ambientTemperature', value: 22, unit: 'C' }],
      })
      expect(res.status).toBe(200)
      return res.body.ranking.derived.low.expectedStandingPressureKpa as number
    }
    // Same ambient as the reference: the reference itself is expected.
    expect(await standingAt22(880)).toBeCloseTo(900, 0)

    const cleared = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R1150', chargeG: 153.8, basis: 'standing-pressure', caseId: opened.body.id })
    expect(cleared.status).toBe(201)
    expect(cleared.body.unit.stages.find((s: { stage: string }) => s.stage === 'low')).toMatchObject({ refrigerant: 'R1150', referenceStandingPressureKpa: null, referenceAmbientC: null })
    expect(cleared.body.warnings.join(' ')).toMatch(/was taken with the previous fill and no longer applies/)
    expect(cleared.body.history[0]).toMatchObject({ standingPressureKpa: null, ambientC: null })
    // Now from the charge: 153.8 g of R1150 in 12 L stands at 1050 kPa abs at 22 °C, where 600 g of
    // R13 stands (R13 Platzer 1990 and R1150 Smukala 2000 EOS via CoolProp 8.0.0), not at the old 900.
    expect(await standingAt22(1040)).toBeCloseTo(1050, -1)

    const measured = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R1150', chargeG: 160, basis: 'standing-pressure', standingPressureKpa: 1080, ambientC: 22, caseId: opened.body.id })
    expect(measured.status).toBe(201)
    expect(measured.body.unit.stages.find((s: { stage: string }) => s.stage === 'low')).toMatchObject({ chargeG: 160, referenceStandingPressureKpa: 1080, referenceAmbientC: 22 })
    expect(measured.body.history[0]).toMatchObject({ standingPressureKpa: 1080, ambientC: 22 })
    expect(await standingAt22(1075)).toBeCloseTo(1080, 0)
    const { events } = (await tech.get(`/api/cases/${opened.body.id}`)).body
    expect(events.filter((e: { type: string }) => e.type === 'nameplate-changed').at(-1)).toMatchObject({ standingPressureKpa: 1080, ambientC: 22 })

    // Half a pair is refused, naming the missing field, and changes nothing.
    const half = await tech.post(`/api/units/${unit.id}/nameplate`, { stage: 'low', refrigerant: 'R170', basis: 'mass', standingPressureKpa: 1000 })
    expect(half.status).toBe(400)
    expect(half.body.data.fieldErrors.ambientC).toBeDefined()
    expect((await tech.get(`/api/units/${unit.id}/nameplate`)).body).toHaveLength(2)
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
