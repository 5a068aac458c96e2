import { describe, expect, it } from 'vitest'
import { DEMO, signedIn } from '../helpers'

describe('organisation isolation', () => {
  it('shows each organisation only its own units; another organisation\'s unit is 404', async () => {
    const tech = await signedIn(DEMO.tech)
    const other = await signedIn(DEMO.otherTech)
    const mine = (await tech.get('/api/units')).body as { id: number; customer: string }[]
    const theirs = (await other.get('/api/units')).body as { id: number }[]
    expect(mine.length).toBeGreaterThanOrEqual(8)
    expect(theirs.length).toBeGreaterThanOrEqual(1)
    expect(mine.map((u) => u.id)).not.toEqual(expect.arrayContaining(theirs.map((u) => u.id)))

    const first = mine[0]!
    expect((await tech.get(`/api/units/${first.id}`)).status).toBe(200)
    const refused = await other.get(`/api/units/${first.id}`)
    expect(refused.status).toBe(404)
    expect(JSON.stringify(refused.body)).not.toContain(first.customer)
  })

  it('returns units in the contract shape', async () => {
    const tech = await signedIn(DEMO.tech)
    const units = (await tech.get('/api/units')).body as Record<string, unknown>[]
    const cascade = units.find((u) => u.kind === 'cascade')!
    expect(cascade).toMatchObject({ id: expect.any(Number), name: expect.any(String), customer: expect.any(String), site: expect.any(String) })
    const stages = cascade.stages as Record<string, unknown>[]
    expect(stages.map((s) => s.stage)).toEqual(['high', 'low'])
    expect(stages[1]).toMatchObject({ refrigerant: expect.any(String), chargeG: expect.any(Number), volumeL: expect.any(Number) })
    expect((await tech.get('/api/units/not-a-number')).status).toBe(400)
  })
})
