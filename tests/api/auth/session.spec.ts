import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, DEMO_PASSWORD, signedIn } from '../helpers'

describe('sign-in, sign-out and me', () => {
  it('signs in, reports the user, signs out', async () => {
    const client = new ApiClient()
    const login = await client.post('/api/auth/login', { email: DEMO.tech, password: DEMO_PASSWORD })
    expect(login.status).toBe(200)
    expect(login.body.user).toMatchObject({ email: DEMO.tech, role: 'technician', name: expect.any(String), id: expect.any(Number) })
    expect(client.cookie).toMatch(/^nuxt-session=/)

    const me = await client.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body).toMatchObject({ email: DEMO.tech, role: 'technician' })

    const logout = await client.post('/api/auth/logout')
    expect(logout.status).toBe(204)
    expect((await client.get('/api/auth/me')).status).toBe(401)
  })

  it('answers 401 with the same message for a wrong password and an unknown e-mail', async () => {
    const wrong = await new ApiClient().post('/api/auth/login', { email: DEMO.tech, password: 'not-the-password' })
    const unknown = await new ApiClient().post('/api/auth/login', { email: 'nobody@rimecase.demo', password: 'whatever-it-is' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.message).toBe(unknown.body.message)
  })

  it('answers 400 with field errors for a malformed body, and for a body that is not JSON', async () => {
    const res = await new ApiClient().post('/api/auth/login', { email: 'not-an-email' })
    expect(res.status).toBe(400)
    expect(res.body.statusCode).toBe(400)
    expect(Object.keys(res.body.data.fieldErrors)).toEqual(expect.arrayContaining(['email', 'password']))
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.mjs/)

    const raw = await new ApiClient().request('POST', '/api/auth/login', '{not json', { headers: { 'content-type': 'application/json' } })
    expect(raw.status).toBe(400)
    expect(raw.body.data.fieldErrors).toBeDefined()
  })

  it('answers 401 for protected routes when signed out', async () => {
    const anon = new ApiClient()
    for (const path of ['/api/auth/me', '/api/units', '/api/units/1', '/api/admin/users']) {
      expect((await anon.get(path)).status, path).toBe(401)
    }
  })

  it('answers a JSON 404 for an unknown API route', async () => {
    const res = await (await signedIn(DEMO.tech)).get('/api/no-such-route')
    expect(res.status).toBe(404)
    expect(res.body).toMatchObject({ statusCode: 404, message: expect.any(String) })
  })
})
