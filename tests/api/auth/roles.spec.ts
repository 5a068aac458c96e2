import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

describe('roles and user administration', () => {
  it('lets only admins use the admin routes', async () => {
    for (const email of [DEMO.tech, DEMO.engineer, DEMO.trainer]) {
      const client = await signedIn(email)
      expect((await client.get('/api/admin/users')).status, email).toBe(403)
      expect((await client.post('/api/admin/users', { email: 'x@y.demo', name: 'X Y', role: 'technician', password: 'long-enough-1' })).status, email).toBe(403)
      expect((await client.patch('/api/admin/users/1', { active: false })).status, email).toBe(403)
    }
    const admin = await signedIn(DEMO.admin)
    const list = await admin.get('/api/admin/users')
    expect(list.status).toBe(200)
    expect(list.body.map((u: { email: string }) => u.email)).toEqual(expect.arrayContaining([DEMO.tech, DEMO.admin]))
    expect(list.body.map((u: { email: string }) => u.email)).not.toContain(DEMO.otherTech)
  })

  it('creates a user, changes the role, and a deactivated user is refused at once', async () => {
    const admin = await signedIn(DEMO.admin)
    const email = `new-${randomUUID().slice(0, 8)}@rimecase.demo`
    const created = await admin.post('/api/admin/users', { email, name: 'New Person', role: 'technician', password: 'a-long-password' })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ email, role: 'technician', active: true })

    const bad = await admin.post('/api/admin/users', { email, name: 'N', role: 'wizard', password: 'short' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fieldErrors)).toEqual(expect.arrayContaining(['name', 'role', 'password']))
    expect((await admin.post('/api/admin/users', { email, name: 'Again', role: 'technician', password: 'a-long-password' })).status).toBe(409)

    const person = await signedIn(email, 'a-long-password')
    expect((await person.get('/api/auth/me')).body.role).toBe('technician')
    const promoted = await admin.patch(`/api/admin/users/${created.body.id}`, { role: 'engineer' })
    expect(promoted.body.role).toBe('engineer')
    expect((await person.get('/api/auth/me')).body.role).toBe('engineer')

    expect((await admin.patch(`/api/admin/users/${created.body.id}`, { active: false })).status).toBe(200)
    expect((await person.get('/api/units')).status).toBe(401)
    expect((await new ApiClient().post('/api/auth/login', { email, password: 'a-long-password' })).status).toBe(401)
  })

  it('does not let an admin change a user of another organisation', async () => {
    const admin = await signedIn(DEMO.admin)
    const other = await signedIn(DEMO.otherTech)
    const otherId = (await other.get('/api/auth/me')).body.id
    expect((await admin.patch(`/api/admin/users/${otherId}`, { active: false })).status).toBe(404)
  })
})
