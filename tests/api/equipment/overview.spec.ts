import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { Upload } from '#server/db/models'
import { DEMO, signedIn } from '../helpers'
import { cascadeBody, customerWithSite } from './fixtures'

describe('GET /api/units/{id}/overview', () => {
  let sequelize: Sequelize
  beforeAll(() => {
    sequelize = createSequelize(process.env.DATABASE_URL!)
  })
  afterAll(() => sequelize.close())

  it('gathers the unit, its refrigerant safety, open and past cases, refrigerant log and uploads', async () => {
    const tech = await signedIn(DEMO.tech)
    const { siteId } = await customerWithSite(tech)
    const { body: unit } = await tech.post('/api/units', cascadeBody(siteId))

    const past = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Warm overnight, alarm at -60 °C', symptoms: ['not-cooling'] })
    const closed = await tech.post(`/api/cases/${past.body.id}/close`, {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }],
      workDone: 'Brazed a cracked flare on the low stage, pressure tested, evacuated and recharged.',
      refrigerantTransactions: [
        { stage: 'low', refrigerant: 'R170', grams: 85, direction: 'added', cylinder: 'ETH-7' },
        { stage: 'low', refrigerant: 'R170', grams: 20, direction: 'recovered', cylinder: 'REC-2' },
      ],
    })
    expect(closed.status).toBe(200)
    const open = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Slow pull-down after defrost', symptoms: ['slow-pulldown'] })
    expect(open.status).toBe(201)

    const user = (await tech.get('/api/auth/me')).body
    const [org] = (await sequelize.query('SELECT organisation_id AS id FROM users WHERE id = :id', { replacements: { id: user.id }, type: 'SELECT' })) as { id: number }[]
    const photo = await Upload.create({ organisationId: org!.id, caseId: null, unitId: unit.id, purpose: 'nameplate', mime: 'image/jpeg', bytes: 1234, originalName: 'plate.jpg', storageKey: 'test/plate.jpg', thumbKey: 'test/plate-thumb.jpg', uploadedBy: user.id })

    const res = await tech.get(`/api/units/${unit.id}/overview`)
    expect(res.status).toBe(200)
    const o = res.body
    expect(o.unit).toEqual(unit)
    // Safety classes per ASHRAE Standard 34: propane and ethane are A3 (flammable).
    expect(o.refrigerants.map((r: { designation: string; safetyClass: string }) => [r.designation, r.safetyClass])).toEqual([['R290', 'A3'], ['R170', 'A3']])
    expect(o.refrigerants[0].cautions.length).toBeGreaterThan(0)
    expect(o.openCases.map((c: { id: number }) => c.id)).toEqual([open.body.id])
    expect(o.pastCases.map((c: { id: number }) => c.id)).toEqual([past.body.id])
    expect(o.pastCaseTotal).toBe(1)
    expect(o.transactions).toHaveLength(2)
    expect(o.transactions[0]).toMatchObject({ stage: 'low', refrigerant: 'R170', cylinder: expect.any(String), at: expect.any(String) })
    expect(o.uploads).toEqual([expect.objectContaining({ id: photo.id, purpose: 'nameplate', url: `/api/uploads/${photo.id}`, thumbUrl: `/api/uploads/${photo.id}?thumb=1` })])
    expect(o.nameplate).toMatchObject({ id: photo.id })
  })

  it('answers 400 for a malformed id and 404 for a missing unit; a trainer may read it', async () => {
    const tech = await signedIn(DEMO.tech)
    expect((await tech.get('/api/units/abc/overview')).status).toBe(400)
    expect((await tech.get('/api/units/99999999/overview')).status).toBe(404)
    const [unit] = (await tech.get('/api/units')).body
    const trainer = await signedIn(DEMO.trainer)
    const seen = await trainer.get(`/api/units/${unit.id}/overview`)
    expect(seen.status).toBe(200)
    expect(seen.body).toMatchObject({ unit: { id: unit.id }, openCases: expect.any(Array), transactions: expect.any(Array) })
  })
})
