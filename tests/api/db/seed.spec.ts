import { fileURLToPath } from 'node:url'
import type { Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { createMigrator } from '#server/db/migrator'
import { up as seedDemo } from '#server/db/seeders/20261202020100-seed-demo-organisations'

const ROOT = fileURLToPath(new URL('../../..', import.meta.url))
const TABLES = ['organisations', 'users', 'customers', 'sites', 'contacts', 'units', 'unit_stages']

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

  it('has no pending migrations', async () => {
    expect(await createMigrator(sequelize, ROOT, 'migrations').pending()).toEqual([])
  })
})
