import { fileURLToPath } from 'node:url'
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { createMigrator } from '#server/db/migrator'
import { up as seedDemo } from '#server/db/seeders/20261202020100-seed-demo-organisations'

const ROOT = fileURLToPath(new URL('../../..', import.meta.url))
const TABLES = ['organisations', 'users', 'customers', 'sites', 'contacts', 'units', 'unit_stages', 'kb_versions', 'kb_rules', 'cases', 'case_events', 'refrigerant_transactions']

async function counts(sequelize: Sequelize) {
  const out: Record<string, number> = {}
  for (const table of TABLES) {
    const [rows] = await sequelize.query(`SELECT count(*)::int AS n FROM ${table}`)
    out[table] = (rows as { n: number }[])[0]!.n
  }
  return out
}

describe('demo seed', () => {
  let sequelize: Sequelize
  beforeAll(() => {
    sequelize = createSequelize(process.env.DATABASE_URL!)
  })
  afterAll(() => sequelize.close())

  it('is already applied, and running the seeders or the demo seed again adds nothing', async () => {
    const before = await counts(sequelize)
    expect(before.organisations).toBeGreaterThanOrEqual(2)
    expect(before.units).toBeGreaterThanOrEqual(9)
    expect(await createMigrator(sequelize, ROOT, 'seeders').up()).toEqual([])
    await seedDemo({ context: sequelize.getQueryInterface() })
    expect(await counts(sequelize)).toEqual(before)
  })

  it('gives the demo organisation a lived-in history: 30+ closed cases with findings and refrigerant, 2 open', async () => {
    const [rows] = await sequelize.query(`
      SELECT c.status, count(*)::int AS n, count(*) FILTER (WHERE jsonb_array_length(c.confirmed_causes) > 0)::int AS confirmed
        FROM cases c JOIN organisations o ON o.id = c.organisation_id
       WHERE o.slug = 'rimecase-demo' AND c.complaint NOT LIKE '%test%'
       GROUP BY c.status`)
    const byStatus = Object.fromEntries((rows as { status: string; n: number; confirmed: number }[]).map((r) => [r.status, r]))
    expect(byStatus.closed!.n).toBeGreaterThanOrEqual(30)
    expect(byStatus.closed!.confirmed).toBe(byStatus.closed!.n)
    const [tx] = await sequelize.query(`SELECT count(DISTINCT case_id)::int AS n FROM refrigerant_transactions`)
    expect((tx as { n: number }[])[0]!.n).toBeGreaterThanOrEqual(10)
    const [open] = await sequelize.query(`SELECT count(*)::int AS n FROM cases c JOIN organisations o ON o.id = c.organisation_id WHERE o.slug = 'rimecase-demo' AND c.status = 'open' AND c.opened_at < now() - interval '30 minutes'`)
    expect((open as { n: number }[])[0]!.n).toBe(2)
  })

  it('has no pending migrations', async () => {
    expect(await createMigrator(sequelize, ROOT, 'migrations').pending()).toEqual([])
  })
})
