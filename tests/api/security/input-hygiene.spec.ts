// Text the database cannot hold faithfully (a NUL character, half of a surrogate pair) is refused
// with 400 naming the field on every route that reads input, and nothing is written.
import { beforeAll, describe, expect, it } from 'vitest'
import { ROUTE_RULES, type RouteRule } from '#server/utils/route-rules'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { fileForm, openCase, samplePng } from '../uploads/fixtures'

const RULES = ROUTE_RULES as Record<string, RouteRule>
const BAD = { nul: 'Door seal\u0000 torn', 'lone surrogate': 'Door seal \uD800 torn', 'lone low surrogate': '\uDC00 torn' }

let admin: ApiClient
let tech: ApiClient
let caseId: number
let unitId: number

beforeAll(async () => {
  ;[admin, tech] = await Promise.all([signedIn(DEMO.admin), signedIn(DEMO.tech)])
  ;({ id: caseId, unitId } = await openCase(tech, 'Input hygiene checks'))
})

describe('unsafe characters', () => {
  it('are refused with 400 on every JSON write route, whatever the field', async () => {
    const wrong: string[] = []
    for (const [key, rule] of Object.entries(RULES)) {
      const [method, path] = key.split(' ') as [string, string]
      if (method === 'GET' || method === '*' || (rule.body ?? 'json') !== 'json' || rule.providedBy) continue
      if (rule.records && Object.values(rule.records).some((k) => k !== 'cases')) continue
      const url = path.replace('[id]', String(caseId))
      for (const [what, text] of Object.entries(BAD)) {
        const res = await admin.request(method, url, { text, complaint: text, nested: { list: ['fine', text] } })
        if (res.status !== 400 || !String(res.body?.message ?? '').includes('cannot be stored')) wrong.push(`${key} with a ${what}: ${res.status} ${res.body?.message}`)
      }
    }
    expect(wrong).toEqual([])
  })

  it('are refused in the fields of a case, naming the field, and nothing is stored', async () => {
    const before = (await tech.get(`/api/cases/${caseId}`)).body
    for (const text of Object.values(BAD)) {
      const opened = await tech.post('/api/cases', { unitId, complaint: text })
      expect(opened.status).toBe(400)
      expect(opened.body.data.fieldErrors.complaint).toBeDefined()
      for (const route of ['notes', 'addendum']) {
        const res = await tech.post(`/api/cases/${caseId}/${route}`, { text })
        expect(res.status, route).toBe(400)
        expect(res.body.data.fieldErrors.text, route).toBeDefined()
      }
      const close = await tech.post(`/api/cases/${caseId}/close`, { confirmedCauses: [{ cause: 'other' }], workDone: text })
      expect(close.status).toBe(400)
      expect(close.body.data.fieldErrors.workDone).toBeDefined()
    }
    const after = (await tech.get(`/api/cases/${caseId}`)).body
    expect(after.version).toBe(before.version)
    expect(after.status).toBe('open')
  })

  it('are refused in a query string and in an uploaded file name', async () => {
    expect((await tech.get('/api/cases?q=%00')).status).toBe(400)
    expect((await tech.get('/api/equipment/units?q=a%00')).status).toBe(400)
    const upload = await tech.post(`/api/cases/${caseId}/uploads`, fileForm(await samplePng(), 'photo\u0000.png', 'image/png'))
    expect(upload.status).toBe(400)
  })
})

describe('array caps', () => {
  it('refuses more than 500 readings in one ranking request', async () => {
    const unit = { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R404A' }] }
    const readings = Array.from({ length: 501 }, () => ({ quantity: 'cabinetTemperature', value: -20, unit: 'C' }))
    const res = await tech.post('/api/diagnosis/rank', { unit, readings })
    expect(res.status).toBe(400)
    expect(res.body.data.fieldErrors.readings).toBeDefined()
  })
})
