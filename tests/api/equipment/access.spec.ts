import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

// Every equipment route, with a body that would be valid apart from who sends it.
const ROUTES: [method: string, path: string, write: boolean][] = [
  ['GET', '/api/customers', false],
  ['POST', '/api/customers', true],
  ['GET', '/api/customers/1', false],
  ['PATCH', '/api/customers/1', true],
  ['GET', '/api/sites', false],
  ['POST', '/api/sites', true],
  ['GET', '/api/sites/1', false],
  ['PATCH', '/api/sites/1', true],
  ['POST', '/api/sites/1/contacts', true],
  ['PATCH', '/api/contacts/1', true],
  ['DELETE', '/api/contacts/1', true],
  ['POST', '/api/units', true],
  ['PATCH', '/api/units/1', true],
  ['GET', '/api/units/1/overview', false],
  ['GET', '/api/equipment/units', false],
]

describe('equipment routes: who may call them', () => {
  it('answers 401 to everyone signed out', async () => {
    const anon = new ApiClient()
    for (const [method, path] of ROUTES) {
      const res = await anon.request(method, path, method === 'GET' || method === 'DELETE' ? undefined : { name: 'x' })
      expect(res.status, `${method} ${path}`).toBe(401)
    }
  })

  it('answers 403 to a trainer on every write, before looking at the record', async () => {
    const trainer = await signedIn(DEMO.trainer)
    for (const [method, path] of ROUTES.filter(([, , write]) => write)) {
      const res = await trainer.request(method, path, method === 'DELETE' ? undefined : { name: 'x' })
      expect(res.status, `${method} ${path}`).toBe(403)
      expect(res.body.message).toBe('Your role may not do this')
    }
  })

  it('answers 400, not 500, to malformed ids and bodies', async () => {
    const tech = await signedIn(DEMO.tech)
    for (const path of ['/api/customers/0', '/api/sites/-1', '/api/units/1.5/overview', '/api/units/abc']) {
      expect((await tech.get(path)).status, path).toBe(400)
    }
    const notJson = await tech.request('POST', '/api/units', '{"name":', { headers: { 'content-type': 'application/json' } })
    expect(notJson.status).toBe(400)
    expect(notJson.body.data.fieldErrors).toBeDefined()
    expect((await tech.post('/api/customers', [])).status).toBe(400)
    expect((await tech.patch('/api/units/1', { stages: null })).status).toBe(400)
    expect((await tech.get('/api/equipment/units?q=a&q=b')).status).toBe(400)
  })
})
