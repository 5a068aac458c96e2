import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'
import { cascadeBody, customerWithSite, singleBody, tag } from './fixtures'

interface Row { id: number; name: string; serial: string; kind: string; customer: string; stages: { refrigerant: string }[] }

describe('the paginated register (GET /api/equipment/units)', () => {
  let tech: ApiClient
  let customerId: number
  let group: string
  const list = async (query: string) => {
    const res = await tech.get(`/api/equipment/units?customerId=${customerId}&${query}`)
    expect(res.status).toBe(200)
    return res.body as { items: Row[]; total: number; page: number; pageSize: number }
  }

  beforeAll(async () => {
    tech = await signedIn(DEMO.tech)
    group = tag()
    const made = await customerWithSite(tech, `Register customer ${group}`)
    customerId = made.customerId
    await tech.post('/api/units', cascadeBody(made.siteId, { name: 'Bravo', serial: `${group}-3` }))
    await tech.post('/api/units', singleBody(made.siteId, { name: 'Alpha', serial: `${group}-2` }))
    await tech.post('/api/units', cascadeBody(made.siteId, { name: 'Charlie', serial: `${group}-1`, stages: [
      { stage: 'high', refrigerant: 'R404A', chargeG: 400 }, { stage: 'low', refrigerant: 'R14', chargeG: 120, volumeL: 6 },
    ] }))
  })

  it('sorts by name, serial and kind in either direction', async () => {
    expect((await list('sort=name')).items.map((u) => u.name)).toEqual(['Alpha', 'Bravo', 'Charlie'])
    expect((await list('sort=name&direction=desc')).items.map((u) => u.name)).toEqual(['Charlie', 'Bravo', 'Alpha'])
    expect((await list('sort=serial')).items.map((u) => u.name)).toEqual(['Charlie', 'Alpha', 'Bravo'])
    expect((await list('sort=kind&direction=desc')).items.map((u) => u.kind)).toEqual(['single-stage', 'cascade', 'cascade'])
    expect((await list('sort=kind')).items.map((u) => u.name)).toEqual(['Bravo', 'Charlie', 'Alpha'])
  })

  it('sorts by customer across the whole organisation', async () => {
    const customersOf = async (direction: string) => {
      const res = await tech.get(`/api/equipment/units?sort=customer&direction=${direction}&pageSize=100`)
      return (res.body as { items: Row[] }).items.map((u) => u.customer)
    }
    const asc = await customersOf('asc')
    const distinct = [...new Set(asc)]
    // Each customer's units come together, and the descending order lists the customers in reverse.
    expect(asc.filter((c, i) => i === 0 || c !== asc[i - 1])).toEqual(distinct)
    expect([...new Set(await customersOf('desc'))]).toEqual([...distinct].reverse())
  })

  it('filters by kind, search text and refrigerant', async () => {
    expect((await list('kind=cascade')).items.map((u) => u.name).sort()).toEqual(['Bravo', 'Charlie'])
    expect((await list('q=alph')).items.map((u) => u.name)).toEqual(['Alpha'])
    expect((await list(`q=${group}-3`)).items.map((u) => u.name)).toEqual(['Bravo'])
    expect((await list('q=r14')).items.map((u) => u.name)).toEqual(['Charlie'])
    expect((await list('q=%25')).total).toBe(0)
    // A refrigerant is found by its name as well as its designation, with or without the hyphen.
    expect((await list('q=tetrafluoromethane')).items.map((u) => u.name)).toEqual(['Charlie'])
    expect((await list('q=R-14')).items.map((u) => u.name)).toEqual(['Charlie'])
    const everywhere = await tech.get(`/api/equipment/units?q=${encodeURIComponent(`Register customer ${group}`)}`)
    expect(everywhere.body.total).toBe(3)
  })

  it('finds the units with an ethylene stage when searching for "ethylene"', async () => {
    const found = (await tech.get('/api/equipment/units?q=ethylene&pageSize=100')).body as { total: number; items: Row[] }
    expect(found.total).toBeGreaterThan(0)
    for (const u of found.items) expect(u.stages.map((s) => s.refrigerant)).toContain('R1150')
  })

  it('pages with a total of all matches', async () => {
    const first = await list('sort=name&pageSize=2')
    expect(first).toMatchObject({ total: 3, page: 1, pageSize: 2 })
    expect(first.items.map((u) => u.name)).toEqual(['Alpha', 'Bravo'])
    const second = await list('sort=name&pageSize=2&page=2')
    expect(second.items.map((u) => u.name)).toEqual(['Charlie'])
    expect(second.items[0]!.stages.map((s) => s.refrigerant)).toEqual(['R404A', 'R14'])
    expect((await list('sort=name&pageSize=2&page=9')).items).toEqual([])
  })

  it('refuses malformed queries with 400 and field errors, and stays within the organisation', async () => {
    for (const query of ['sort=colour', 'direction=up', 'page=0', 'pageSize=101', 'kind=triple', 'customerId=abc', 'unknown=1']) {
      const res = await tech.get(`/api/equipment/units?${query}`)
      expect(res.status, query).toBe(400)
      expect(res.body.data.fieldErrors, query).toBeDefined()
    }
    expect((await new ApiClient().get('/api/equipment/units')).status).toBe(401)
    const trainer = await signedIn(DEMO.trainer)
    expect((await trainer.get('/api/equipment/units')).status).toBe(200)
    const other = await signedIn(DEMO.otherTech)
    const theirs = await other.get(`/api/equipment/units?customerId=${customerId}`)
    expect(theirs.body).toMatchObject({ items: [], total: 0 })
    const allTheirs = (await other.get('/api/equipment/units?pageSize=100')).body as { items: Row[] }
    expect(allTheirs.items.some((u) => u.customer.startsWith('Register customer'))).toBe(false)
  })
})
