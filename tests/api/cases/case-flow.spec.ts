import { describe, expect, it } from 'vitest'
import { DEMO, signedIn, type ApiClient } from '../helpers'

async function cascadeUnitWith(client: ApiClient, refrigerant: string) {
  const units = (await client.get('/api/units')).body as { id: number; kind: string; stages: { stage: string; refrigerant: string }[] }[]
  return units.find((u) => u.kind === 'cascade' && u.stages.some((s) => s.stage === 'low' && s.refrigerant === refrigerant))!
}

describe('case record through the contract routes', () => {
  it('opens, takes readings and a test outcome, re-ranks, closes with refrigerant, then refuses changes', async () => {
    const tech = await signedIn(DEMO.tech)
    const unit = await cascadeUnitWith(tech, 'R170')
    const opened = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Cabinet at -40 °C, alarm overnight', symptoms: ['not-cooling'] })
    expect(opened.status).toBe(201)
    expect(opened.body).toMatchObject({ id: expect.any(Number), status: 'open', unitId: unit.id })
    const id = opened.body.id

    const withReadings = await tech.post(`/api/cases/${id}/readings`, {
      readings: [
        { quantity: 'cabinetTemperature', value: -40, unit: 'C' },
        { quantity: 'cascadeHxTemperature', value: -33, unit: 'C' },
        { quantity: 'compressorRunning', stage: 'high', value: true, unit: 'bool' },
        { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
      ],
    })
    expect(withReadings.status).toBe(200)
    expect(withReadings.body.ranking.causes.length).toBeGreaterThan(2)
    expect(withReadings.body.ranking.tests[0]).toMatchObject({ test: 'standing-pressure-check', stage: 'low' })
    const before = withReadings.body.ranking.causes[0]

    const withOutcome = await tech.post(`/api/cases/${id}/test-results`, { test: 'standing-pressure-check', stage: 'low', outcome: 'low' })
    expect(withOutcome.status).toBe(200)
    const after = withOutcome.body.ranking.causes[0]
    expect(after).toMatchObject({ cause: 'refrigerant-leak', stage: 'low' })
    expect(after.probability).toBeGreaterThan(before.cause === 'refrigerant-leak' ? before.probability : 0)

    const record = await tech.get(`/api/cases/${id}`)
    expect(record.body).toMatchObject({ id, unitId: unit.id, status: 'open', symptoms: ['not-cooling'] })
    expect(record.body.readings).toHaveLength(4)
    expect(record.body.testResults).toHaveLength(1)
    const types = record.body.events.map((e: { type: string }) => e.type)
    expect(types).toEqual(expect.arrayContaining(['case-opened', 'symptoms-set', 'reading-entered', 'test-proposed', 'outcome-recorded', 'ranking-snapshot']))
    for (const e of record.body.events) expect(e).toMatchObject({ at: expect.any(String), type: expect.any(String) })
    expect(record.body.events.find((e: { type: string }) => e.type === 'ranking-snapshot').knowledgeBaseVersion).toMatchObject({ status: 'published' })

    const closed = await tech.post(`/api/cases/${id}/close`, {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }],
      workDone: 'Found and brazed a cracked flare on the low-stage filter drier; pressure tested with nitrogen, evacuated, recharged.',
      refrigerantTransactions: [{ stage: 'low', refrigerant: 'R170', grams: 180, direction: 'added', cylinder: 'ETH-0042' }],
    })
    expect(closed.status).toBe(200)
    expect(closed.body.status).toBe('closed')
    // A closed case keeps its last causes but proposes no next test, also when read again.
    expect(closed.body.ranking.causes[0]).toMatchObject({ cause: 'refrigerant-leak', stage: 'low' })
    expect(closed.body.ranking.tests).toEqual([])
    expect((await tech.get(`/api/cases/${id}`)).body.ranking.tests).toEqual([])
    expect(closed.body.transactions).toEqual([expect.objectContaining({ stage: 'low', refrigerant: 'R170', grams: 180, direction: 'added', cylinder: 'ETH-0042' })])

    expect((await tech.post(`/api/cases/${id}/readings`, { readings: [{ quantity: 'cabinetTemperature', value: -79, unit: 'C' }] })).status).toBe(409)
    expect((await tech.post(`/api/cases/${id}/test-results`, { test: 'leak-search', stage: 'low', outcome: 'found' })).status).toBe(409)
    const addendum = await tech.post(`/api/cases/${id}/addendum`, { text: 'Customer called: holding -80 °C next morning.' })
    expect(addendum.status).toBe(200)
    expect(addendum.body.events.at(-1).type).toBe('addendum')
  })

  it('catches a concurrent edit with 409 instead of losing it', async () => {
    const tech = await signedIn(DEMO.tech)
    const unit = await cascadeUnitWith(tech, 'R170')
    const opened = (await tech.post('/api/cases', { unitId: unit.id, complaint: 'Slow pull-down after defrost', symptoms: [] })).body
    const version = opened.version
    const first = await tech.post(`/api/cases/${opened.id}/readings`, { version, readings: [{ quantity: 'cabinetTemperature', value: -60, unit: 'C' }] })
    expect(first.status).toBe(200)
    const second = await tech.post(`/api/cases/${opened.id}/readings`, { version, readings: [{ quantity: 'cabinetTemperature', value: -61, unit: 'C' }] })
    expect(second.status).toBe(409)
    expect(second.body.message).toMatch(/changed by someone else/)
    expect((await tech.get(`/api/cases/${opened.id}`)).body.readings).toHaveLength(1)
  })

  it('keeps every reading when several arrive at once without a version (nothing is lost)', async () => {
    const tech = await signedIn(DEMO.tech)
    const unit = await cascadeUnitWith(tech, 'R170')
    const opened = (await tech.post('/api/cases', { unitId: unit.id, complaint: 'Two gauges read out at once' })).body
    const posts = Array.from({ length: 6 }, (_, i) => tech.post(`/api/cases/${opened.id}/readings`, { readings: [{ quantity: 'cabinetTemperature', value: -50 - i, unit: 'C' }] }))
    const results = await Promise.all(posts)
    expect(results.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200])
    const record = (await tech.get(`/api/cases/${opened.id}`)).body
    expect(record.readings.map((r: { value: number }) => r.value).sort()).toEqual([-50, -51, -52, -53, -54, -55].sort())
    expect(record.events.filter((e: { type: string }) => e.type === 'reading-entered')).toHaveLength(6)
    expect(record.version).toBe(opened.version + 6)
  })

  it('refuses bad input with 400 and another organisation with 404', async () => {
    const tech = await signedIn(DEMO.tech)
    const other = await signedIn(DEMO.otherTech)
    const unit = await cascadeUnitWith(tech, 'R170')
    expect((await tech.post('/api/cases', { unitId: unit.id, complaint: '' })).status).toBe(400)
    expect((await tech.post('/api/cases', { unitId: unit.id, complaint: 'ok complaint', symptoms: ['haunted'] })).status).toBe(400)
    expect((await other.post('/api/cases', { unitId: unit.id, complaint: 'not my unit' })).status).toBe(404)
    const opened = (await tech.post('/api/cases', { unitId: unit.id, complaint: 'Warm cabinet' })).body
    const wrongStage = await tech.post(`/api/cases/${opened.id}/readings`, { readings: [{ quantity: 'suctionPressure', stage: 'single', value: 1, unit: 'bar' }] })
    expect(wrongStage.status).toBe(400)
    expect((await tech.post(`/api/cases/${opened.id}/readings`, { readings: [{ quantity: 'suctionPressure', stage: 'low', value: 'ten', unit: 'bar' }] })).status).toBe(400)
    expect((await other.get(`/api/cases/${opened.id}`)).status).toBe(404)
    expect((await other.post(`/api/cases/${opened.id}/readings`, { readings: [{ quantity: 'cabinetTemperature', value: -20, unit: 'C' }] })).status).toBe(404)
    const badClose = await tech.post(`/api/cases/${opened.id}/close`, { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], workDone: 'x', refrigerantTransactions: [{ stage: 'low', refrigerant: 'R170', grams: -5, direction: 'added' }] })
    expect(badClose.status).toBe(400)
  })

  it('lists cases open first with filters and full-text search', async () => {
    const tech = await signedIn(DEMO.tech)
    const unit = await cascadeUnitWith(tech, 'R170')
    await tech.post('/api/cases', { unitId: unit.id, complaint: 'Compressor hums and trips on overload', symptoms: ['compressor-tripping'] })
    const list = await tech.get('/api/cases?pageSize=5')
    expect(list.status).toBe(200)
    expect(list.body.items.length).toBeLessThanOrEqual(5)
    expect(list.body.total).toBeGreaterThan(0)
    const found = await tech.get(`/api/cases?q=${encodeURIComponent('overload trips')}`)
    expect(found.body.items.some((c: { complaint: string }) => c.complaint.includes('overload'))).toBe(true)
    const none = await (await signedIn(DEMO.otherTech)).get(`/api/cases?q=overload`)
    expect(none.body.items).toEqual([])
    expect((await tech.get('/api/cases?status=bogus')).status).toBe(400)
  })
})

describe('case list filters', () => {
  it('filters by technician, confirmed cause and dates, and lists only the organisation\'s people', async () => {
    const engineer = await signedIn(DEMO.engineer)
    const people = (await engineer.get('/api/people')).body as { id: number; name: string }[]
    expect(people.length).toBeGreaterThanOrEqual(4)
    expect(JSON.stringify(people)).not.toContain('@')
    const tech = people.find((p) => (p as { role?: string }).role === 'technician')!
    const byTech = (await engineer.get(`/api/cases?technicianId=${tech.id}&pageSize=100`)).body
    expect(byTech.total).toBeGreaterThan(0)
    expect(byTech.items.every((c: { technician: string }) => c.technician === tech.name)).toBe(true)
    const leaks = (await engineer.get('/api/cases?cause=refrigerant-leak&status=closed&pageSize=100')).body
    expect(leaks.total).toBeGreaterThan(0)
    expect(leaks.items.every((c: { confirmedCauses: { cause: string }[] }) => c.confirmedCauses.some((k) => k.cause === 'refrigerant-leak'))).toBe(true)
    const future = (await engineer.get('/api/cases?from=2099-01-01')).body
    expect(future.total).toBe(0)
    const otherPeople = (await (await signedIn(DEMO.otherTech)).get('/api/people')).body as { name: string }[]
    expect(otherPeople.map((p) => p.name)).not.toContain(tech.name)
  })
})

describe('case list rows', () => {
  it('carry only what the list shows, with the current most likely cause, open cases first and newest first', async () => {
    const tech = await signedIn(DEMO.tech)
    const unit = await cascadeUnitWith(tech, 'R170')
    const opened = (await tech.post('/api/cases', { unitId: unit.id, complaint: 'List row check: cabinet warm', symptoms: ['not-cooling'] })).body
    const ranked = (await tech.post(`/api/cases/${opened.id}/readings`, { readings: [{ quantity: 'suctionPressure', stage: 'low', value: 2, unit: 'psig' }] })).body
    const page = (await tech.get('/api/cases?pageSize=100')).body
    expect(page).toMatchObject({ page: 1, pageSize: 100 })
    expect(page.items.length).toBeLessThanOrEqual(100)
    const row = page.items.find((c: { id: number }) => c.id === opened.id)
    expect(Object.keys(row).sort()).toEqual(['closedAt', 'complaint', 'confirmedCauses', 'customer', 'id', 'openedAt', 'status', 'technician', 'topCause', 'unitId', 'unitName'])
    const top = ranked.ranking.causes[0]
    expect(row).toMatchObject({ status: 'open', unitId: unit.id, unitName: unit.name, confirmedCauses: [], closedAt: null, topCause: { cause: top.cause, probability: top.probability } })
    expect(row.topCause.stage).toBe(top.stage)
    const order = page.items.map((c: { status: string; openedAt: string }) => [c.status === 'open' ? 0 : 1, -Date.parse(c.openedAt)])
    expect(order).toEqual([...order].sort((a: number[], b: number[]) => a[0]! - b[0]! || a[1]! - b[1]!))
    const beyond = (await tech.get(`/api/cases?pageSize=100&page=${Math.ceil(page.total / 100) + 1}`)).body
    expect(beyond).toMatchObject({ items: [], total: page.total })
  })
})
