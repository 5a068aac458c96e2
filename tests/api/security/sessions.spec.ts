// Server-side sessions, the cookie's attributes, e-mail uniqueness within an organisation, and
// the rate limits on sign-in, report sending and account changes.
import { randomUUID } from 'node:crypto'
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { startApp } from '../app-process'
import { ApiClient, DEMO, DEMO_PASSWORD, signedIn } from '../helpers'
import { openCase } from '../uploads/fixtures'

let sequelize: Sequelize
let admin: ApiClient

const fresh = (what: string) => `${what}-${randomUUID().slice(0, 8)}@rimecase.demo`

async function newUser(role = 'technician', password = 'a-long-password') {
  const email = fresh(role)
  const res = await admin.post('/api/admin/users', { email, name: `Session ${role}`, role, password })
  expect(res.status).toBe(201)
  return { id: res.body.id as number, email, password }
}

/** A client carrying the same cookie: a copy kept by someone else. */
function copyOf(client: ApiClient): ApiClient {
  const copy = new ApiClient(client.baseUrl)
  copy.cookie = client.cookie
  return copy
}

beforeAll(async () => {
  sequelize = createSequelize(process.env.DATABASE_URL!)
  admin = await signedIn(DEMO.admin)
})

afterAll(async () => {
  // The limits counted here must not refuse the other test files' sign-ins.
  await sequelize.query('DELETE FROM rate_limits')
  await sequelize.close()
})

describe('the session cookie', () => {
  it('is HttpOnly and SameSite=Lax, and not Secure on a plain-http site', async () => {
    const res = await fetch(`${admin.baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: DEMO.tech, password: DEMO_PASSWORD }) })
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))!
    expect(cookie).toMatch(/; HttpOnly/i)
    expect(cookie).toMatch(/; SameSite=Lax/i)
    expect(cookie).not.toMatch(/; Secure/i)
  })

  it('is Secure when the site address is https', async () => {
    const app = await startApp({ NUXT_SITE_URL: 'https://rimecase.example.org' })
    try {
      const res = await fetch(`${app.baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: DEMO.tech, password: DEMO_PASSWORD }) })
      expect(res.status).toBe(200)
      const cookie = res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))!
      expect(cookie).toMatch(/; Secure/i)
      expect(cookie).toMatch(/; HttpOnly/i)
      // The site's own https origin may write; another may not.
      const write = (origin: string) => fetch(`${app.baseUrl}/api/auth/logout`, { method: 'POST', headers: { origin } })
      expect((await write('https://rimecase.example.org')).status).toBe(204)
      expect((await write('https://elsewhere.example.org')).status).toBe(403)
    } finally {
      await app.stop()
    }
  }, 60_000)
})

describe('sessions end', () => {
  it('on sign-out, for every copy of the cookie', async () => {
    const tech = await signedIn(DEMO.tech)
    const saved = copyOf(tech)
    expect((await saved.get('/api/auth/me')).status).toBe(200)
    expect((await tech.post('/api/auth/logout')).status).toBe(204)
    expect((await saved.get('/api/auth/me')).status).toBe(401)
    expect((await saved.get('/api/units')).status).toBe(401)
    expect((await saved.get('/api/_auth/session')).status).toBe(401)
  })

  it('on deactivation, and stay ended when the account is active again', async () => {
    const user = await newUser()
    const client = await signedIn(user.email, user.password)
    const saved = copyOf(client)
    expect((await admin.patch(`/api/admin/users/${user.id}`, { active: false })).status).toBe(200)
    expect((await saved.get('/api/auth/me')).status).toBe(401)
    expect((await admin.patch(`/api/admin/users/${user.id}`, { active: true })).status).toBe(200)
    expect((await saved.get('/api/auth/me')).status).toBe(401)
    expect((await (await signedIn(user.email, user.password)).get('/api/auth/me')).status).toBe(200)
  })

  it('on a password change: all sessions when an admin sets it, the others when the person changes it', async () => {
    const user = await newUser()
    const phone = await signedIn(user.email, user.password)
    const laptop = await signedIn(user.email, user.password)
    const wrong = await phone.post('/api/auth/password', { currentPassword: 'not-the-password', newPassword: 'another-long-password' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fieldErrors.currentPassword).toBeDefined()
    expect((await phone.post('/api/auth/password', { currentPassword: user.password, newPassword: 'another-long-password' })).status).toBe(204)
    expect((await phone.get('/api/auth/me')).status).toBe(200)
    expect((await laptop.get('/api/auth/me')).status).toBe(401)
    expect((await new ApiClient().post('/api/auth/login', { email: user.email, password: user.password })).status).toBe(401)

    expect((await admin.patch(`/api/admin/users/${user.id}`, { password: 'set-by-the-admin-1' })).status).toBe(200)
    expect((await phone.get('/api/auth/me')).status).toBe(401)
    expect((await (await signedIn(user.email, 'set-by-the-admin-1')).get('/api/auth/me')).status).toBe(200)
  })
})

describe('e-mail addresses', () => {
  it('are unique within the organisation; an address used elsewhere reveals nothing and both accounts work', async () => {
    const created = await admin.post('/api/admin/users', { email: DEMO.otherTech, name: 'Same Address', role: 'technician', password: 'own-org-password' })
    expect(created.status).toBe(201)
    expect((await admin.post('/api/admin/users', { email: DEMO.otherTech, name: 'Again', role: 'technician', password: 'own-org-password' })).status).toBe(409)
    const ours = await signedIn(DEMO.otherTech, 'own-org-password')
    const theirs = await signedIn(DEMO.otherTech, DEMO_PASSWORD)
    expect((await ours.get('/api/auth/me')).body.id).toBe(created.body.id)
    expect((await theirs.get('/api/auth/me')).body.id).not.toBe(created.body.id)
    const names = (client: ApiClient) => client.get('/api/units').then((r) => (r.body as { id: number }[]).map((u) => u.id))
    expect(await names(ours)).not.toEqual(await names(theirs))
    // The other test files expect the demo organisation's list without this address.
    await sequelize.query('DELETE FROM users WHERE id = $1', { bind: [created.body.id] })
  })
})

describe('rate limits', () => {
  it('refuse sign-in to an account after 10 failures, with Retry-After, even with the right password', async () => {
    await sequelize.query('DELETE FROM rate_limits')
    const user = await newUser()
    const anon = new ApiClient()
    for (let i = 0; i < 10; i++) expect((await anon.post('/api/auth/login', { email: user.email, password: `wrong-${i}` })).status).toBe(401)
    const refused = await anon.post('/api/auth/login', { email: user.email, password: user.password })
    expect(refused.status).toBe(429)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
    expect(refused.body.message).toMatch(/Try again in/)
    await sequelize.query('DELETE FROM rate_limits')
  })

  it('refuse sign-in from one address after 30 failures across accounts', async () => {
    await sequelize.query('DELETE FROM rate_limits')
    const anon = new ApiClient()
    const statuses: number[] = []
    for (let i = 0; i < 31; i++) statuses.push((await anon.post('/api/auth/login', { email: fresh('nobody'), password: 'wrong' })).status)
    expect(statuses.slice(0, 30).every((s) => s === 401)).toBe(true)
    expect((await anon.post('/api/auth/login', { email: DEMO.tech, password: DEMO_PASSWORD })).status).toBe(429)
    await sequelize.query('DELETE FROM rate_limits')
    expect((await anon.post('/api/auth/login', { email: DEMO.tech, password: DEMO_PASSWORD })).status).toBe(200)
  }, 60_000)

  it('throttle report e-mails per person and account changes per admin', async () => {
    await sequelize.query('DELETE FROM rate_limits')
    const sender = await newUser()
    const client = await signedIn(sender.email, sender.password)
    const { id } = await openCase(client, 'Throttle checks')
    const contact = (await sequelize.query<{ email: string }>(
      'SELECT c.email FROM contacts c JOIN units u ON u.site_id = c.site_id JOIN cases k ON k.unit_id = u.id WHERE k.id = $1 LIMIT 1', { bind: [id], type: 'SELECT' as never }))[0]
    const body = contact ? { to: contact.email } : {}
    for (let i = 0; i < 20; i++) expect((await client.post(`/api/cases/${id}/report/send`, body)).status).toBe(202)
    const throttled = await client.post(`/api/cases/${id}/report/send`, body)
    expect(throttled.status).toBe(429)
    expect(throttled.headers.get('retry-after')).toBeTruthy()

    const second = await newUser('admin')
    const other = await signedIn(second.email, second.password)
    const target = await newUser()
    const statuses: number[] = []
    for (let i = 0; i < 31; i++) statuses.push((await other.patch(`/api/admin/users/${target.id}`, { name: `Renamed ${i}` })).status)
    expect(statuses.slice(0, 30).every((s) => s === 200)).toBe(true)
    expect(statuses[30]).toBe(429)
    await sequelize.query('DELETE FROM rate_limits')
  }, 120_000)
})
