import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { customerWithSite, tag } from './fixtures'

describe('sites and contacts', () => {
  it('creates and edits a site; its altitude sets the local atmospheric pressure', async () => {
    const tech = await signedIn(DEMO.tech)
    const { customerId } = await customerWithSite(tech)
    const created = await tech.post('/api/sites', { customerId, name: `Hill lab ${tag()}`, address: 'Top Road', altitudeM: 1500 })
    expect(created.status).toBe(201)
    // U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), table of pressure: 84.56 kPa at 1 500 m.
    expect(created.body.atmosphericPressureKpa).toBeCloseTo(84.56, 1)
    expect(created.body).toMatchObject({ customerId, altitudeM: 1500, address: 'Top Road', contacts: [], unitCount: 0 })

    const moved = await tech.patch(`/api/sites/${created.body.id}`, { altitudeM: 0, name: 'Shore lab' })
    expect(moved.status).toBe(200)
    // Same standard atmosphere at sea level: 101.325 kPa.
    expect(moved.body).toMatchObject({ name: 'Shore lab', address: 'Top Road' })
    expect(moved.body.atmosphericPressureKpa).toBeCloseTo(101.325, 1)

    const listed = await tech.get(`/api/sites?customerId=${customerId}`)
    expect(listed.body.map((s: { id: number }) => s.id)).toContain(created.body.id)
    expect(listed.body.every((s: { customerId: number }) => s.customerId === customerId)).toBe(true)
  })

  it('refuses a bad altitude, a missing customer and a malformed filter', async () => {
    const tech = await signedIn(DEMO.tech)
    const { customerId, siteId } = await customerWithSite(tech)
    for (const altitudeM of [5200, -500, 'high']) {
      const res = await tech.post('/api/sites', { customerId, name: 'Bad altitude', altitudeM })
      expect(res.status).toBe(400)
      expect(res.body.data.fieldErrors.altitudeM).toHaveLength(1)
    }
    expect((await tech.patch(`/api/sites/${siteId}`, { altitudeM: 9000 })).status).toBe(400)
    expect((await tech.get(`/api/sites/${siteId}`)).body.altitudeM).toBe(120)
    const noCustomer = await tech.post('/api/sites', { customerId: 99999999, name: 'Nowhere', altitudeM: 0 })
    expect(noCustomer.status).toBe(404)
    expect(noCustomer.body.data.fieldErrors.customerId).toBeDefined()
    expect((await tech.get('/api/sites?customerId=abc')).status).toBe(400)
  })

  it('adds, edits and removes contacts; e-mail addresses are checked', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const bad = await tech.post(`/api/sites/${siteId}/contacts`, { name: 'Lab desk', email: 'lab-desk@' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fieldErrors.email).toEqual(['Enter a valid e-mail address'])

    const added = await tech.post(`/api/sites/${siteId}/contacts`, { name: 'Lab desk', email: 'Lab.Desk@Harlow.example', phone: '+00 555 0199' })
    expect(added.status).toBe(201)
    expect(added.body).toMatchObject({ siteId, name: 'Lab desk', email: 'lab.desk@harlow.example', receivesReports: true })
    const id = added.body.id

    const changed = await tech.patch(`/api/contacts/${id}`, { receivesReports: false })
    expect(changed.body).toMatchObject({ name: 'Lab desk', receivesReports: false })
    expect((await tech.patch(`/api/contacts/${id}`, { email: 'nope' })).status).toBe(400)
    expect((await tech.get(`/api/sites/${siteId}`)).body.contacts).toEqual([expect.objectContaining({ id, email: 'lab.desk@harlow.example', receivesReports: false })])

    expect((await tech.request('DELETE', `/api/contacts/${id}`)).status).toBe(204)
    expect((await tech.request('DELETE', `/api/contacts/${id}`)).status).toBe(404)
    expect((await tech.get(`/api/sites/${siteId}`)).body.contacts).toEqual([])
  })

  it('answers 401, 403 and 404 as the roles and organisations require', async () => {
    const tech = await signedIn(DEMO.tech)
    const { customerId, siteId } = await customerWithSite(tech)
    const contact = (await tech.post(`/api/sites/${siteId}/contacts`, { name: 'Night porter', email: 'porter@harlow.example' })).body

    const anon = new ApiClient()
    expect((await anon.get(`/api/sites/${siteId}`)).status).toBe(401)
    expect((await anon.request('DELETE', `/api/contacts/${contact.id}`)).status).toBe(401)

    const trainer = await signedIn(DEMO.trainer)
    expect((await trainer.get(`/api/sites/${siteId}`)).status).toBe(200)
    expect((await trainer.post('/api/sites', { customerId, name: 'Trainer site', altitudeM: 0 })).status).toBe(403)
    expect((await trainer.patch(`/api/sites/${siteId}`, { name: 'no' })).status).toBe(403)
    expect((await trainer.post(`/api/sites/${siteId}/contacts`, { name: 'x', email: 'x@y.example' })).status).toBe(403)
    expect((await trainer.patch(`/api/contacts/${contact.id}`, { name: 'no' })).status).toBe(403)
    expect((await trainer.request('DELETE', `/api/contacts/${contact.id}`)).status).toBe(403)

    const other = await signedIn(DEMO.otherTech)
    expect((await other.get(`/api/sites/${siteId}`)).status).toBe(404)
    expect((await other.patch(`/api/sites/${siteId}`, { name: 'mine' })).status).toBe(404)
    expect((await other.post('/api/sites', { customerId, name: 'Sneaky', altitudeM: 0 })).status).toBe(404)
    expect((await other.post(`/api/sites/${siteId}/contacts`, { name: 'x', email: 'x@y.example' })).status).toBe(404)
    expect((await other.patch(`/api/contacts/${contact.id}`, { name: 'mine' })).status).toBe(404)
    expect((await other.request('DELETE', `/api/contacts/${contact.id}`)).status).toBe(404)
    expect((await other.get(`/api/sites?customerId=${customerId}`)).body).toEqual([])
    expect((await tech.get(`/api/sites/${siteId}`)).body.contacts).toHaveLength(1)
  })
})
