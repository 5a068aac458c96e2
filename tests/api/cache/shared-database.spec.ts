// Several app processes, on one machine or many, share one database. Each keeps caches in memory;
// here two servers run on the same database, and a change made through one (or by a script
// writing to the database) must be what the other answers with on the very next request.
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { Organisation } from '#server/db/models'
import { insertKnowledgeBaseVersion } from '#server/db/repositories/knowledge'
import { CONTENT_DIR } from '#server/db/seeders/20261202030200-import-knowledge-base'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { BASE_URL, DEMO, SECOND_BASE_URL, signedIn, type ApiClient } from '../helpers'

const RANK_REQUEST = {
  unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R404A' }, { stage: 'low', refrigerant: 'R170' }] },
  symptoms: ['not-cooling'],
}

let sequelize: Sequelize
let a: ApiClient
let b: ApiClient

beforeAll(async () => {
  if (!SECOND_BASE_URL) throw new Error('RIMECASE_TEST_SECOND_BASE_URL is not set: scripts/test.mjs starts a second server on the same database')
  sequelize = createSequelize(process.env.DATABASE_URL!)
  ;[a, b] = await Promise.all([signedIn(DEMO.tech, undefined, BASE_URL), signedIn(DEMO.tech, undefined, SECOND_BASE_URL)])
})
afterAll(() => sequelize?.close())

describe('two servers on one database', () => {
  it('a unit edited through one server is the unit the other uses on its next case step', async () => {
    // A customer and site of its own, so the demo register stays as the browser tests expect it.
    const customer = await a.post('/api/customers', { name: `Shared-cache customer ${Date.now()}` })
    const site = await a.post('/api/sites', { customerId: customer.body.id, name: 'Cache lab', altitudeM: 120 })
    const created = await a.post('/api/units', {
      name: `Shared-cache freezer ${Date.now()}`, model: 'Icebox 9', serial: `SC-${Date.now()}`, kind: 'cascade', equipmentClass: 'ult-freezer', siteId: site.body.id,
      stages: [{ stage: 'high', refrigerant: 'R404A' }, { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7.5 }],
    })
    expect(created.status).toBe(201)
    const unitId = created.body.id as number
    const caseId = (await b.post('/api/cases', { unitId, complaint: 'Edited while open' })).body.id as number
    const reading = (value: number) => b.post(`/api/cases/${caseId}/readings`, { readings: [{ quantity: 'cabinetTemperature', value, unit: 'C' }] })
    expect((await reading(-60)).body.unit.location).toBe('')

    for (const [i, location] of ['Cell 4', 'Cell 5', 'Corridor B'].entries()) {
      const lowRefrigerant = i % 2 === 0 ? 'R1150' : 'R170'
      const patched = await a.patch(`/api/units/${unitId}`, { location, stages: [{ stage: 'high', refrigerant: 'R404A' }, { stage: 'low', refrigerant: lowRefrigerant }] })
      expect(patched.status).toBe(200)
      const next = await reading(-61 - i)
      expect(next.status).toBe(200)
      expect(next.body.unit.location).toBe(location)
      expect(next.body.unit.stages.find((s: { stage: string }) => s.stage === 'low').refrigerant).toBe(lowRefrigerant)
    }
  })

  it('a case closed through one server moves the starting odds the other ranks with', async () => {
    const confirmed = async (client: ApiClient) => {
      const note = (await client.post('/api/diagnosis/rank', RANK_REQUEST)).body.priorNote as string
      return Number(/adjusted by (\d+) definitively confirmed cause/.exec(note)?.[1] ?? 0)
    }
    const before = await confirmed(b)
    const units = (await a.get('/api/units')).body as { id: number; kind: string }[]
    const cascade = units.find((u) => u.kind === 'cascade')!
    for (let i = 1; i <= 2; i++) {
      const id = (await a.post('/api/cases', { unitId: cascade.id, complaint: `Closed through the other server ${i}` })).body.id
      expect((await a.post(`/api/cases/${id}/close`, { confirmedCauses: [{ cause: 'condenser-airflow', stage: 'high' }], workDone: 'Cleaned the condenser.' })).status).toBe(200)
      expect(await confirmed(b)).toBe(before + i)
    }
  })

  it('a version published by another writer is the one both servers rank with', async () => {
    const [oa, ob] = await Promise.all([signedIn(DEMO.otherTech, undefined, BASE_URL), signedIn(DEMO.otherTech, undefined, SECOND_BASE_URL)])
    const versionOf = async (client: ApiClient) => (await client.post('/api/diagnosis/rank', RANK_REQUEST)).body.knowledgeBaseVersion.id as number
    const before = await versionOf(ob)
    expect(await versionOf(oa)).toBe(before)
    // Published the way `npm run kb:import -- --publish` does: straight into the database.
    const org = (await Organisation.findOne({ where: { slug: 'bluefen-demo' } }))!
    const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
    const published = await sequelize.transaction((t) => insertKnowledgeBaseVersion(org.id, source, { label: 'shared-cache check', status: 'published' }, t))
    expect(published.id).not.toBe(before)
    expect(await versionOf(ob)).toBe(published.id)
    expect(await versionOf(oa)).toBe(published.id)
  })
})
