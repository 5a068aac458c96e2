import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn, type ApiResponse } from '../helpers'
import { otherOrganisation, workedClosedCase } from './helpers'

/** Every personal detail of a case's unit: customer, site (name, address), contacts (names, e-mails, telephones) and serial. */
async function secretsOf(admin: ApiClient, caseId: number): Promise<string[]> {
  const unitId = (await admin.get(`/api/cases/${caseId}`)).body.unitId
  const unit = (await admin.get(`/api/units/${unitId}`)).body
  const site = (await admin.get(`/api/sites/${unit.siteId}`)).body
  const customer = (await admin.get(`/api/customers/${unit.customerId}`)).body
  const contacts = site.contacts as { name: string; email: string; phone: string }[]
  const secrets = [customer.name, unit.customer, site.name, unit.site, site.address, unit.serial, ...contacts.flatMap((c) => [c.name, c.email, c.phone])]
  expect(contacts.length).toBeGreaterThan(0)
  return secrets.filter((s: string) => s && s.trim().length > 0)
}

/** Checks every key and value of a response against every secret. */
function expectNoSecrets(res: ApiResponse, secrets: string[], where: string) {
  const leaves: string[] = []
  const walk = (v: unknown, path: string) => {
    if (v === null || v === undefined) return
    if (Array.isArray(v)) return v.forEach((x, i) => walk(x, `${path}[${i}]`))
    if (typeof v === 'object') return Object.entries(v as Record<string, unknown>).forEach(([k, x]) => { leaves.push(`${path}.${k}=${k}`); walk(x, `${path}.${k}`) })
    leaves.push(`${path}=${String(v)}`)
  }
  walk(res.body, where)
  expect(leaves.length).toBeGreaterThan(0)
  for (const leaf of leaves) {
    const value = leaf.slice(leaf.indexOf('=') + 1).toLowerCase()
    for (const secret of secrets) expect(value.includes(secret.toLowerCase()), `${leaf} holds "${secret}"`).toBe(false)
  }
}

describe('exercises', () => {
  it('never returns the customer’s, site’s or contacts’ details or the serial from any exercise route', async () => {
    const tech = await signedIn(DEMO.tech)
    const admin = await signedIn(DEMO.admin)
    const trainer = await signedIn(DEMO.trainer)
    // A case whose complaint names the customer, site, contact and serial, as people do write them.
    const units = (await tech.get('/api/units')).body as { id: number; kind: string; stages: { stage: string; refrigerant: string }[]; serial: string; customer: string; site: string; siteId: number }[]
    const unit = units.find((u) => u.kind === 'cascade' && u.stages.some((s) => s.stage === 'low' && s.refrigerant === 'R170'))!
    const site = (await admin.get(`/api/sites/${unit.siteId}`)).body
    const contact = site.contacts[0]
    const complaint = `${unit.customer} (${unit.site}, ${site.address}): ${contact.name} says serial ${unit.serial} is at -40 °C. Call ${contact.phone} or ${contact.email}.`
    const opened = (await tech.post('/api/cases', { unitId: unit.id, complaint, symptoms: ['not-cooling'] })).body
    await tech.post(`/api/cases/${opened.id}/readings`, { readings: [{ quantity: 'cabinetTemperature', value: -40, unit: 'C' }, { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' }] })
    await tech.post(`/api/cases/${opened.id}/test-results`, { test: 'standing-pressure-check', stage: 'low', outcome: 'low' })
    await tech.post(`/api/cases/${opened.id}/close`, { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], workDone: `Repaired for ${contact.name}` })
    const secrets = await secretsOf(admin, opened.id)

    const techId = (await tech.get('/api/auth/me')).body.id
    const created = await trainer.post('/api/exercises', { caseId: opened.id, title: 'Warm ULT freezer', start: { complaint: true, symptoms: true, readings: [{ quantity: 'cabinetTemperature' }] }, assignees: [techId] })
    expect(created.status).toBe(201)
    expect(Object.keys(created.body)).toEqual(['id'])
    const x = created.body.id
    const responses: [string, ApiResponse][] = [['create', created]]
    responses.push(['get (trainer)', await trainer.get(`/api/exercises/${x}`)])
    responses.push(['get (trainee)', await tech.get(`/api/exercises/${x}`)])
    responses.push(['list (trainer)', await trainer.get('/api/exercises')])
    responses.push(['list (trainee)', await tech.get('/api/exercises')])
    responses.push(['patch', await trainer.patch(`/api/exercises/${x}`, { title: `Warm ULT freezer at ${unit.customer}, serial ${unit.serial}` })])
    expect(responses.at(-1)![1].body.title).toBe('Warm ULT freezer at [name removed], serial [serial removed]')
    responses.push(['assignees', await trainer.put(`/api/exercises/${x}/assignees`, { userIds: [techId] })])
    const attempt = await tech.post(`/api/exercises/${x}/attempts`)
    responses.push(['start attempt', attempt])
    responses.push(['reading', await tech.post(`/api/exercise-attempts/${attempt.body.id}/requests`, { kind: 'reading', quantity: 'compressorRunning', stage: 'low' })])
    responses.push(['test', await tech.post(`/api/exercise-attempts/${attempt.body.id}/requests`, { kind: 'test', test: 'standing-pressure-check', stage: 'low' })])
    responses.push(['answer', await tech.post(`/api/exercise-attempts/${attempt.body.id}/answer`, { causes: [{ stage: 'high', cause: 'no-refrigeration-fault' }, { stage: 'low', cause: 'refrigerant-leak' }] })])
    responses.push(['attempt (trainee)', await tech.get(`/api/exercise-attempts/${attempt.body.id}`)])
    responses.push(['attempt (trainer)', await trainer.get(`/api/exercise-attempts/${attempt.body.id}`)])
    responses.push(['attempts of exercise', await trainer.get(`/api/exercises/${x}/attempts`)])
    responses.push(['recent attempts', await trainer.get('/api/exercise-attempts')])
    for (const [where, res] of responses) {
      expect(res.status, where).toBeLessThan(300)
      expectNoSecrets(res, secrets, where)
    }
    // The complaint survives with stand-ins, so the trainee still reads what was wrong.
    const view = responses[2]![1].body
    expect(view.complaint).toContain('-40 °C')
    expect(view.complaint).toContain('[name removed]')
    expect(view.unit).toMatchObject({ name: 'Practice unit', customer: 'Practice customer', site: 'Practice site' })
    expect(view.startReadings).toEqual([{ quantity: 'cabinetTemperature', value: -40, unit: 'C' }])
    // The trainee's view carries no way back to the case.
    expect(responses[4]![1].body.find((e: { id: number }) => e.id === x).caseId).toBeNull()
    expect(responses[3]![1].body.find((e: { id: number }) => e.id === x).caseId).toBe(opened.id)
  })

  it('answers requests with the recorded values or "not recorded", charges their minutes once, and scores the answer', async () => {
    const tech = await signedIn(DEMO.tech)
    const trainer = await signedIn(DEMO.trainer)
    const caseId = await workedClosedCase(tech)
    const x = (await trainer.post('/api/exercises', { caseId, title: 'Standing pressure practice' })).body.id
    const view = (await tech.get(`/api/exercises/${x}`)).body
    expect(view.startReadings).toEqual([])
    expect(view.symptoms).toEqual(['not-cooling'])
    const standing = view.tests.find((t: { test: string }) => t.test === 'standing-pressure-check')
    const attempt = (await tech.post(`/api/exercises/${x}/attempts`)).body
    expect(attempt).toMatchObject({ requests: [], minutesSpent: 0, finishedAt: null, score: null, enginePath: null })
    const a = `/api/exercise-attempts/${attempt.id}`
    const r1 = await tech.post(`${a}/requests`, { kind: 'reading', quantity: 'cascadeHxTemperature' })
    expect(r1.body.requests[0]).toMatchObject({ kind: 'reading', quantity: 'cascadeHxTemperature', found: true, value: -33, unit: 'C', minutes: view.readingMinutes })
    const r2 = await tech.post(`${a}/requests`, { kind: 'reading', quantity: 'dischargePressure', stage: 'high' })
    expect(r2.body.requests[1]).toMatchObject({ found: false, minutes: view.readingMinutes })
    expect(r2.body.requests[1].value).toBeUndefined()
    // Asked twice, charged once.
    const again = await tech.post(`${a}/requests`, { kind: 'reading', quantity: 'cascadeHxTemperature' })
    expect(again.body.requests).toHaveLength(2)
    const r3 = await tech.post(`${a}/requests`, { kind: 'test', test: 'standing-pressure-check', stage: 'low' })
    expect(r3.body.requests[2]).toMatchObject({ kind: 'test', found: true, outcome: 'low', minutes: standing.minutes, invasive: false })
    expect(r3.body.minutesSpent).toBe(2 * view.readingMinutes + standing.minutes)
    // The repair-phase standing pressure of the case is not diagnosis material.
    const repair = await tech.post(`${a}/requests`, { kind: 'reading', quantity: 'standingPressure', stage: 'low' })
    expect(repair.body.requests[3]).toMatchObject({ found: false })

    expect((await tech.post(`${a}/answer`, { causes: [{ stage: 'low', cause: 'refrigerant-leak' }] })).status).toBe(422)
    expect((await trainer.post(`${a}/answer`, { causes: [{ stage: 'high', cause: 'no-refrigeration-fault' }, { stage: 'low', cause: 'refrigerant-leak' }] })).status).toBe(403)
    const done = await tech.post(`${a}/answer`, { causes: [{ stage: 'high', cause: 'no-refrigeration-fault' }, { stage: 'low', cause: 'refrigerant-leak' }] })
    expect(done.status).toBe(200)
    expect(done.body.score).toMatchObject({ rightStages: 2, causePoints: 70, minutesSpent: done.body.minutesSpent, penalty: 0 })
    expect(done.body.score.engineMinutes).toBeGreaterThan(0)
    expect(done.body.enginePath.length).toBeGreaterThan(0)
    expect(done.body.finishedAt).not.toBeNull()
    expect((await tech.post(`${a}/requests`, { kind: 'reading', quantity: 'ambientTemperature' })).status).toBe(409)
    expect((await tech.post(`${a}/answer`, { causes: [{ stage: 'high', cause: 'no-refrigeration-fault' }, { stage: 'low', cause: 'refrigerant-leak' }] })).status).toBe(409)
    expect((await tech.post(`${a}/requests`, { kind: 'guess' })).status).toBe(400)
  })

  it('lets trainers see everyone’s attempts and trainees only their own', async () => {
    const tech = await signedIn(DEMO.tech)
    const engineer = await signedIn(DEMO.engineer)
    const trainer = await signedIn(DEMO.trainer)
    const x = (await trainer.post('/api/exercises', { caseId: await workedClosedCase(tech), title: 'Two trainees' })).body.id
    const mine = (await tech.post(`/api/exercises/${x}/attempts`)).body
    const theirs = (await engineer.post(`/api/exercises/${x}/attempts`)).body
    const techId = (await tech.get('/api/auth/me')).body.id
    const own = (await tech.get(`/api/exercises/${x}/attempts`)).body
    expect(own.map((t: { id: number }) => t.id)).toEqual([mine.id])
    expect((await tech.get(`/api/exercise-attempts/${theirs.id}`)).status).toBe(404)
    expect((await tech.get('/api/exercise-attempts')).body.every((t: { userId: number }) => t.userId === techId)).toBe(true)
    const all = (await trainer.get(`/api/exercises/${x}/attempts`)).body.map((t: { id: number }) => t.id)
    expect(all).toEqual(expect.arrayContaining([mine.id, theirs.id]))
    expect((await trainer.get(`/api/exercise-attempts/${mine.id}`)).status).toBe(200)
  })

  it('checks roles, organisations and input on every exercise route', async () => {
    const tech = await signedIn(DEMO.tech)
    const trainer = await signedIn(DEMO.trainer)
    const caseId = await workedClosedCase(tech)
    const x = (await trainer.post('/api/exercises', { caseId, title: 'Access checks' })).body.id
    const attempt = (await tech.post(`/api/exercises/${x}/attempts`)).body.id
    const anonymous = new ApiClient()
    const otherTech = await signedIn(DEMO.otherTech)
    const otherTrainer = await otherOrganisation('trainer')
    const routes: [string, string, unknown?][] = [
      ['POST', '/api/exercises', { caseId, title: 'x y z' }],
      ['GET', '/api/exercises'],
      ['GET', `/api/exercises/${x}`],
      ['PATCH', `/api/exercises/${x}`, { title: 'Renamed' }],
      ['PUT', `/api/exercises/${x}/assignees`, { userIds: [] }],
      ['POST', `/api/exercises/${x}/attempts`],
      ['GET', `/api/exercises/${x}/attempts`],
      ['GET', '/api/exercise-attempts'],
      ['GET', `/api/exercise-attempts/${attempt}`],
      ['POST', `/api/exercise-attempts/${attempt}/requests`, { kind: 'reading', quantity: 'ambientTemperature' }],
      ['POST', `/api/exercise-attempts/${attempt}/answer`, { causes: [{ stage: 'low', cause: 'other' }] }],
    ]
    for (const [method, path, body] of routes) expect((await anonymous.request(method, path, body)).status, `${method} ${path}`).toBe(401)
    // Trainer-only routes refuse technicians.
    expect((await tech.post('/api/exercises', { caseId, title: 'Not mine to make' })).status).toBe(403)
    expect((await tech.patch(`/api/exercises/${x}`, { title: 'Renamed' })).status).toBe(403)
    expect((await tech.put(`/api/exercises/${x}/assignees`, { userIds: [] })).status).toBe(403)
    // Another organisation sees nothing of this one.
    for (const client of [otherTech, otherTrainer]) {
      expect((await client.get(`/api/exercises/${x}`)).status).toBe(404)
      expect((await client.post(`/api/exercises/${x}/attempts`)).status).toBe(404)
      expect((await client.get(`/api/exercises/${x}/attempts`)).status).toBe(404)
      expect((await client.get(`/api/exercise-attempts/${attempt}`)).status).toBe(404)
      expect((await client.post(`/api/exercise-attempts/${attempt}/requests`, { kind: 'reading', quantity: 'ambientTemperature' })).status).toBe(404)
      expect((await client.post(`/api/exercise-attempts/${attempt}/answer`, { causes: [{ stage: 'low', cause: 'other' }] })).status).toBe(404)
      expect((await client.get('/api/exercises')).body.some((e: { id: number }) => e.id === x)).toBe(false)
    }
    expect((await otherTrainer.post('/api/exercises', { caseId, title: 'Their case' })).status).toBe(404)
    expect((await otherTrainer.patch(`/api/exercises/${x}`, { title: 'Renamed' })).status).toBe(404)
    expect((await otherTrainer.put(`/api/exercises/${x}/assignees`, { userIds: [] })).status).toBe(404)
    const otherTechId = (await otherTech.get('/api/auth/me')).body.id
    expect((await trainer.put(`/api/exercises/${x}/assignees`, { userIds: [otherTechId] })).status).toBe(404)
    // Input: open cases, bad bodies, unknown ids.
    const open = (await tech.post('/api/cases', { unitId: (await tech.get('/api/units')).body[0].id, complaint: 'Still open' })).body.id
    expect((await trainer.post('/api/exercises', { caseId: open, title: 'From an open case' })).status).toBe(422)
    expect((await trainer.post('/api/exercises', { caseId: 'x', title: '' })).status).toBe(400)
    expect((await trainer.post('/api/exercises', { caseId, title: 'Unrecorded start', start: { readings: [{ quantity: 'dischargePressure', stage: 'high' }] } })).status).toBe(422)
    expect((await trainer.get('/api/exercises/99999999')).status).toBe(404)
    expect((await trainer.get('/api/exercise-attempts/99999999')).status).toBe(404)
    expect((await tech.post(`/api/exercise-attempts/${attempt}/requests`, { kind: 'test', test: 'standing-pressure-check' })).status).toBe(422)
  })
})
