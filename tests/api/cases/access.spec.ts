import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { fileForm, openCase, samplePng } from '../uploads/fixtures'

let tech: ApiClient
let trainer: ApiClient
let other: ApiClient
let caseId: number
let unitId: number

beforeAll(async () => {
  ;[tech, trainer, other] = await Promise.all([signedIn(DEMO.tech), signedIn(DEMO.trainer), signedIn(DEMO.otherTech)])
  ;({ id: caseId, unitId } = await openCase(tech, 'Access checks on every case write route'))
})

// Every route that changes a case, with a body that would pass validation.
const WRITES: { name: string; method: 'POST' | 'PUT'; path: () => string; body: () => unknown }[] = [
  { name: 'open a case', method: 'POST', path: () => '/api/cases', body: () => ({ unitId, complaint: 'A complaint in a few words' }) },
  { name: 'add readings', method: 'POST', path: () => `/api/cases/${caseId}/readings`, body: () => ({ readings: [{ quantity: 'cabinetTemperature', value: -40, unit: 'C' }] }) },
  { name: 'record a test outcome', method: 'POST', path: () => `/api/cases/${caseId}/test-results`, body: () => ({ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }) },
  { name: 'set symptoms', method: 'PUT', path: () => `/api/cases/${caseId}/symptoms`, body: () => ({ symptoms: ['not-cooling'] }) },
  { name: 'add a note', method: 'POST', path: () => `/api/cases/${caseId}/notes`, body: () => ({ text: 'Door seal torn at the hinge side.' }) },
  { name: 'add an addendum', method: 'POST', path: () => `/api/cases/${caseId}/addendum`, body: () => ({ text: 'Customer called back.' }) },
  { name: 'close the case', method: 'POST', path: () => `/api/cases/${caseId}/close`, body: () => ({ confirmedCauses: [{ cause: 'other' }], workDone: 'Nothing found today.' }) },
  { name: 'send the report', method: 'POST', path: () => `/api/cases/${caseId}/report/send`, body: () => ({ to: 'lab@example.test' }) },
]

describe('case write routes', () => {
  for (const route of WRITES) {
    it(`${route.name}: 401 signed out, 403 for a trainer, and nothing changes`, async () => {
      const before = (await tech.get(`/api/cases/${caseId}`)).body
      expect((await new ApiClient().request(route.method, route.path(), route.body())).status).toBe(401)
      const refused = await trainer.request(route.method, route.path(), route.body())
      expect(refused.status).toBe(403)
      expect(refused.body.message).toBe('Your role may not do this')
      const after = (await tech.get(`/api/cases/${caseId}`)).body
      expect(after.version).toBe(before.version)
      expect(after.events).toHaveLength(before.events.length)
    })
  }

  it('add a photo: 401 signed out, 403 for a trainer, 404 for another organisation', async () => {
    const png = await samplePng()
    expect((await new ApiClient().post(`/api/cases/${caseId}/uploads`, fileForm(png, 'a.png', 'image/png'))).status).toBe(401)
    expect((await trainer.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'a.png', 'image/png'))).status).toBe(403)
    expect((await other.post(`/api/cases/${caseId}/uploads`, fileForm(png, 'a.png', 'image/png'))).status).toBe(404)
  })

  it('treat another organisation\'s case as missing on every write', async () => {
    for (const route of WRITES.slice(1)) {
      expect((await other.request(route.method, route.path(), route.body())).status, route.name).toBe(404)
    }
  })
})

describe('one rule, one status', () => {
  it('a stage the unit lacks is a 400 naming the field in words, on readings, outcomes and closing alike', async () => {
    const units = (await tech.get('/api/units')).body as { id: number; kind: string }[]
    const cascade = units.find((u) => u.kind === 'cascade')!
    const id = (await tech.post('/api/cases', { unitId: cascade.id, complaint: 'Stage checks' })).body.id
    const reading = await tech.post(`/api/cases/${id}/readings`, { readings: [{ quantity: 'suctionPressure', stage: 'single', value: 1, unit: 'bar' }] })
    const outcome = await tech.post(`/api/cases/${id}/test-results`, { test: 'standing-pressure-check', stage: 'single', outcome: 'low' })
    const close = await tech.post(`/api/cases/${id}/close`, { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'single' }], workDone: 'Checked it.' })
    for (const [res, key] of [[reading, 'readings.0.stage'], [outcome, 'testResults.0.stage'], [close, 'confirmedCauses.0.stage']] as const) {
      expect(res.status).toBe(400)
      expect(res.body.data.fieldErrors[key]).toEqual([expect.stringMatching(/^Single stage is not a stage of .+; it has High stage and Low stage$/)])
      expect(res.body.message).toMatch(/^(Reading 1|Test result 1|Confirmed cause 1): single stage is not a stage of /)
      expect(res.body.message).not.toMatch(/"single"|readings\.|\.stage/)
    }
  })

  it('a closed case refuses every change with 409, and an open one refuses an addendum with 409', async () => {
    const { id } = await openCase(tech, 'Closed-case checks')
    expect((await tech.post(`/api/cases/${id}/addendum`, { text: 'Too early' })).status).toBe(409)
    expect((await tech.post(`/api/cases/${id}/close`, { confirmedCauses: [{ cause: 'other' }], workDone: 'Nothing found today.' })).status).toBe(200)
    expect((await tech.post(`/api/cases/${id}/notes`, { text: 'Late note' })).status).toBe(409)
    expect((await tech.put(`/api/cases/${id}/symptoms`, { symptoms: [] })).status).toBe(409)
    expect((await tech.post(`/api/cases/${id}/close`, { confirmedCauses: [{ cause: 'other' }], workDone: 'Again.' })).status).toBe(409)
  })

  it('a malformed field is named in words in the message', async () => {
    const { id } = await openCase(tech, 'Word checks')
    const res = await tech.post(`/api/cases/${id}/close`, {
      confirmedCauses: [{ cause: 'other' }], workDone: 'Done.', refrigerantTransactions: [{ stage: 'low', refrigerant: 'R170', grams: 'lots', direction: 'added' }],
    })
    expect(res.status).toBe(400)
    expect(res.body.message).toBe('Refrigerant added or recovered, line 1: grams must be a number')
    expect(res.body.data.fieldErrors['refrigerantTransactions.0.grams']).toEqual(['Grams must be a number'])
  })
})
