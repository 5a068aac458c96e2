import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { customerWithSite, tag } from './fixtures'

describe('customers', () => {
  it('creates, reads and edits a customer', async () => {
    const tech = await signedIn(DEMO.tech)
    const name = `Harlow Cryo Labs ${tag()}`
    const created = await tech.post('/api/customers', { name, notes: 'Ring the bell twice' })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ id: expect.any(Number), name, notes: 'Ring the bell twice', unitCount: 0, sites: [] })

    const changed = await tech.patch(`/api/customers/${created.body.id}`, { notes: 'Use the side door' })
    expect(changed.status).toBe(200)
    expect(changed.body).toMatchObject({ name, notes: 'Use the side door' })
    expect((await tech.get(`/api/customers/${created.body.id}`)).body.notes).toBe('Use the side door')
  })

  it('refuses an empty name, an unknown field and a name already in use (any case)', async () => {
    const tech = await signedIn(DEMO.tech)
    const empty = await tech.post('/api/customers', { name: '  ' })
    expect(empty.status).toBe(400)
    expect(empty.body.data.fieldErrors.name).toEqual(['Enter the name'])
    expect((await tech.post('/api/customers', { name: 'Ok name', colour: 'red' })).status).toBe(400)

    const { name, customerId } = await customerWithSite(tech)
    const again = await tech.post('/api/customers', { name: name.toUpperCase() })
    expect(again.status).toBe(409)
    expect(again.body.data.fieldErrors.name).toBeDefined()
    const other = await customerWithSite(tech)
    expect((await tech.patch(`/api/customers/${other.customerId}`, { name })).status).toBe(409)
    expect((await tech.patch(`/api/customers/${customerId}`, {})).status).toBe(400)
    expect((await tech.get(`/api/customers/${customerId}`)).body.name).toBe(name)
  })

  it('lists customers with server-side search, order and pages', async () => {
    const tech = await signedIn(DEMO.tech)
    const group = tag()
    for (const letter of ['C', 'A', 'B']) await tech.post('/api/customers', { name: `${letter} Register ${group}` })

    const byName = await tech.get(`/api/customers?q=${group}&sort=name&direction=desc`)
    expect(byName.status).toBe(200)
    expect(byName.body).toMatchObject({ total: 3, page: 1, pageSize: 20 })
    expect(byName.body.items.map((c: { name: string }) => c.name[0])).toEqual(['C', 'B', 'A'])

    const second = await tech.get(`/api/customers?q=${group}&sort=createdAt&direction=asc&pageSize=2&page=2`)
    expect(second.body.items.map((c: { name: string }) => c.name[0])).toEqual(['B'])
    expect(second.body.total).toBe(3)

    const bySite = await tech.get('/api/customers?q=Cold%20Store%20Wing')
    expect(bySite.body.items.map((c: { name: string }) => c.name)).toContain('Lindqvarn Biobank')
    expect((await tech.get('/api/customers?sort=colour')).status).toBe(400)
    expect((await tech.get('/api/customers?pageSize=1000')).status).toBe(400)
  })

  it('answers 401 signed out, 403 to a trainer writing, 404 for another organisation', async () => {
    const tech = await signedIn(DEMO.tech)
    const { customerId, name } = await customerWithSite(tech)
    expect((await new ApiClient().get('/api/customers')).status).toBe(401)
    expect((await new ApiClient().post('/api/customers', { name: 'x' })).status).toBe(401)

    const trainer = await signedIn(DEMO.trainer)
    expect((await trainer.get(`/api/customers/${customerId}`)).status).toBe(200)
    expect((await trainer.post('/api/customers', { name: `Trainer ${tag()}` })).status).toBe(403)
    expect((await trainer.patch(`/api/customers/${customerId}`, { notes: 'no' })).status).toBe(403)

    const other = await signedIn(DEMO.otherTech)
    const refused = await other.get(`/api/customers/${customerId}`)
    expect(refused.status).toBe(404)
    expect(JSON.stringify(refused.body)).not.toContain(name)
    expect((await other.patch(`/api/customers/${customerId}`, { notes: 'mine now' })).status).toBe(404)
    const list = await other.get('/api/customers?pageSize=100')
    expect(list.body.items.map((c: { name: string }) => c.name)).not.toContain(name)
  })
})
