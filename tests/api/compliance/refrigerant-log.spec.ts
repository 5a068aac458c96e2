// The refrigerant log over HTTP: lines by hand and from case closings, leak rates after each addition
// judged against the organisation's jurisdiction, the F-gas view, cylinders, duties due, and who may
// see and change what. The jurisdiction is switched to the US federal rules for this file and put back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { customerWithSite, singleBody, tag } from '../equipment/fixtures'

const LB = 453.59237 // grams in a pound, exact by definition
let tech: ApiClient
let admin: ApiClient
let trainer: ApiClient
let other: ApiClient
let unitId: number
let previous: { jurisdiction: string; leakRateMethod: string }
const cylinder = `T-REC-${tag()}`

beforeAll(async () => {
  ;[tech, admin, trainer, other] = await Promise.all([signedIn(DEMO.tech), signedIn(DEMO.admin), signedIn(DEMO.trainer), signedIn(DEMO.otherTech)])
  previous = (await admin.get('/api/compliance/settings')).body
  expect((await admin.put('/api/compliance/settings', { jurisdiction: 'us-federal', leakRateMethod: 'annualizing' })).status).toBe(200)
  const { siteId } = await customerWithSite(tech)
  const unit = await tech.post('/api/units', singleBody(siteId, { name: `Walk-in ${tag()}`, equipmentClass: 'cold-room', designCabinetC: -20, stages: [{ stage: 'single', refrigerant: 'R404A', chargeG: 100 * LB }] }))
  expect(unit.status).toBe(201)
  unitId = unit.body.id
  const settings = await tech.put(`/api/units/${unitId}/compliance-settings`, { applianceType: 'commercial-refrigeration' })
  expect(settings.status).toBe(200)
})

afterAll(async () => {
  await admin.put('/api/compliance/settings', { jurisdiction: previous.jurisdiction, leakRateMethod: previous.leakRateMethod })
})

describe('the refrigerant log of a unit', () => {
  it('works out the leak rate after each addition by both methods and judges it for the appliance type', async () => {
    const first = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 10 * LB, direction: 'added', cylinder: 'SUP-1', at: '2026-01-05' })
    expect(first.status).toBe(201)
    const res = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 10 * LB, direction: 'added', cylinder: 'SUP-1', at: '2026-07-04' })
    expect(res.status).toBe(201)
    const stage = res.body.stages[0]
    expect(stage.entries).toHaveLength(2)
    expect(stage.additions).toHaveLength(2)
    // First addition on record: the annualizing method divides by 365 days (40 CFR 82.152 "leak rate"; 84.106(b)).
    expect(stage.additions[0].annualizingPercent).toBeCloseTo(10, 9)
    // 10 lb into a 100 lb charge, 180 days after the last addition: (10/100) / (180/365) × 100 = 20.28 %
    // (40 CFR 82.152, annualizing method; the figures are invented for this test).
    const second = stage.additions[1]
    expect(second.daysSinceLastAddition).toBe(180)
    expect(second.annualizingPercent).toBeCloseTo((10 / 100 / (180 / 365)) * 100, 9)
    // Rolling average: everything added over the past 365 days ÷ full charge (40 CFR 82.152): 20 lb / 100 lb.
    expect(second.rollingAveragePercent).toBeCloseTo(20, 9)
    // R404A is an HFC; from 1 January 2026 40 CFR 84.106 sets 20 % for commercial refrigeration from 15 lb.
    expect(second.assessment).toMatchObject({ jurisdiction: 'us-federal', applies: true, thresholdPercent: 20, exceedsThreshold: true, repairWithinDays: 30 })
    expect(res.body.duties).toContainEqual(expect.objectContaining({ kind: 'repair', dueBy: '2026-08-03', overdue: true }))
  })

  it('shows the EU F-gas view under both regulations (charge in kg × GWP ÷ 1000)', async () => {
    const res = await tech.get(`/api/units/${unitId}/refrigerant-log`)
    expect(res.status).toBe(200)
    expect(res.body.fGas.map((f: { basis: string }) => f.basis).sort()).toEqual(['eu-2014', 'eu-2024'])
    for (const view of res.body.fGas) {
      // R404A GWP 3922 (Regulation (EU) No 517/2014 Annex IV; 2024/573 Annex VI): 45.359 kg × 3922 / 1000 = 177.9 t.
      expect(view.annexITonnesCo2e).toBeCloseTo((100 * LB * 3922) / 1e6, 6)
      // 50 to 500 t CO2e: every 6 months without a leak detection system (517/2014 Art. 4(3)(b); 2024/573 Art. 5(3)(b)).
      expect(view.leakCheckIntervalMonths).toBe(6)
    }
  })

  it('tracks recovered refrigerant to its cylinder, which becomes a record', async () => {
    const res = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 1500, direction: 'recovered', cylinder, at: '2026-08-01' })
    expect(res.status).toBe(201)
    expect(res.body.stages[0].recoveredByCylinder).toContainEqual({ cylinder, refrigerant: 'R404A', grams: 1500 })
    const list = await tech.get('/api/cylinders')
    const record = list.body.find((c: { label: string }) => c.label === cylinder)
    expect(record).toMatchObject({ purpose: 'recovery', recovered: [{ refrigerant: 'R404A', grams: 1500 }], netG: 1500 })
    expect(record.units).toContainEqual({ id: unitId, name: expect.any(String) })
    const detail = await tech.get(`/api/cylinders/${record.id}`)
    expect(detail.body.transactions).toContainEqual(expect.objectContaining({ unitId, grams: 1500, direction: 'recovered', technician: expect.any(String) }))
    expect((await other.get(`/api/cylinders/${record.id}`)).status).toBe(404)
    const again = await tech.post('/api/cylinders', { label: cylinder.toLowerCase() })
    expect(again.status).toBe(409)
    expect(again.body.data.fieldErrors.label).toBeDefined()
  })

  it('records a repair, after which the verification test is due instead', async () => {
    const res = await tech.post(`/api/units/${unitId}/compliance-checks`, { kind: 'repair', stage: 'single', passed: true, at: '2026-07-20' })
    expect(res.status).toBe(201)
    expect(res.body.checks).toContainEqual(expect.objectContaining({ kind: 'repair', stage: 'single', passed: true }))
    expect(res.body.duties.map((d: { kind: string }) => d.kind)).not.toContain('repair')
    expect(res.body.duties).toContainEqual(expect.objectContaining({ kind: 'verification-test' }))
  })

  it('is fed by the refrigerant transactions of a case closing', async () => {
    const opened = await tech.post('/api/cases', { unitId, complaint: 'Warm walk-in', symptoms: ['not-cooling'] })
    expect(opened.status).toBe(201)
    const closed = await tech.post(`/api/cases/${opened.body.id}/close`, {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'single' }], workDone: 'Brazed a cracked flare, pressure tested, evacuated, charged by weight.',
      refrigerantTransactions: [{ stage: 'single', refrigerant: 'R404A', grams: 2000, direction: 'added', cylinder: 'SUP-2' }],
    })
    expect(closed.status).toBe(200)
    const log = (await tech.get(`/api/units/${unitId}/refrigerant-log`)).body
    const entry = log.stages[0].entries.find((e: { caseId: number | null }) => e.caseId === opened.body.id)
    expect(entry).toMatchObject({ grams: 2000, direction: 'added', cylinder: 'SUP-2', technician: expect.any(String) })
    expect(log.stages[0].additions.at(-1).caseId).toBe(opened.body.id)
  })

  it('refuses bad lines with the field named and changes nothing', async () => {
    const before = (await tech.get(`/api/units/${unitId}/refrigerant-log`)).body.stages[0].entries.length
    const noCylinder = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 100, direction: 'recovered' })
    expect(noCylinder.status).toBe(400)
    expect(noCylinder.body.data.fieldErrors.cylinder).toBeDefined()
    const wrongStage = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'low', refrigerant: 'R404A', grams: 100, direction: 'added' })
    expect(wrongStage.status).toBe(400)
    expect(wrongStage.body.data.fieldErrors.stage).toBeDefined()
    const negative = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: -5, direction: 'added' })
    expect(negative.status).toBe(400)
    const future = await tech.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 5, direction: 'added', at: '2099-01-01' })
    expect(future.status).toBe(400)
    expect(future.body.data.fieldErrors.at).toBeDefined()
    expect((await tech.get(`/api/units/${unitId}/refrigerant-log`)).body.stages[0].entries).toHaveLength(before)
  })
})

describe('the list of units with duties due', () => {
  it('lists the unit whose repair is outstanding, soonest first', async () => {
    const res = await tech.get('/api/compliance/due?horizonDays=30')
    expect(res.status).toBe(200)
    expect(res.body.jurisdiction.id).toBe('us-federal')
    expect(res.body.due).toContainEqual(expect.objectContaining({ unitId, kind: 'verification-test', citation: expect.stringContaining('84.106') }))
    const days = res.body.due.map((d: { dueBy: string }) => d.dueBy)
    expect(days).toEqual([...days].sort())
    expect((await tech.get('/api/compliance/due?horizonDays=-1')).status).toBe(400)
  })

  it('shows another organisation none of these units', async () => {
    const res = await other.get('/api/compliance/due')
    expect(res.status).toBe(200)
    expect(res.body.duties.map((d: { unitId: number }) => d.unitId)).not.toContain(unitId)
  })
})

describe('who may do what', () => {
  it('answers 401 without a session', async () => {
    const anon = new ApiClient()
    for (const path of [`/api/units/${unitId}/refrigerant-log`, '/api/compliance/due', '/api/compliance/settings', '/api/cylinders']) expect((await anon.get(path)).status).toBe(401)
  })

  it('lets a trainer read the log but not write to it', async () => {
    expect((await trainer.get(`/api/units/${unitId}/refrigerant-log`)).status).toBe(200)
    expect((await trainer.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 5, direction: 'added' })).status).toBe(403)
    expect((await trainer.put(`/api/units/${unitId}/compliance-settings`, { applianceType: 'other' })).status).toBe(403)
  })

  it('hides the unit from another organisation (404, not 403)', async () => {
    expect((await other.get(`/api/units/${unitId}/refrigerant-log`)).status).toBe(404)
    expect((await other.post(`/api/units/${unitId}/refrigerant-log`, { stage: 'single', refrigerant: 'R404A', grams: 5, direction: 'added' })).status).toBe(404)
    expect((await other.post(`/api/units/${unitId}/compliance-checks`, { kind: 'leak-check', passed: true })).status).toBe(404)
    expect((await other.put(`/api/units/${unitId}/compliance-settings`, { applianceType: 'other' })).status).toBe(404)
  })

  it('lets only an administrator set the jurisdiction, and only to one on file', async () => {
    expect((await tech.put('/api/compliance/settings', { jurisdiction: 'eu' })).status).toBe(403)
    const unknown = await admin.put('/api/compliance/settings', { jurisdiction: 'atlantis' })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fieldErrors.jurisdiction[0]).toMatch(/us-federal/)
  })
})
