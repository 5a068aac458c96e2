// Runs the migrations in server/db/migrations with Umzug, recording them in "SequelizeMeta"
// (the same table sequelize-cli uses), and the seeders in server/db/seeders in "SequelizeData".
import { readdirSync } from 'node:fs'
import { join } from 'node:path'
import { pathToFileURL } from 'node:url'
import type { QueryInterface, Sequelize } from 'sequelize'
import { SequelizeStorage, Umzug } from 'umzug'

type Step = { up: (p: { context: QueryInterface }) => Promise<void>; down?: (p: { context: QueryInterface }) => Promise<void> }

function stepsIn(dir: string, sequelize: Sequelize) {
  return readdirSync(dir)
    .filter((f) => /^\d{14}-[a-z0-9-]+\.ts$/.test(f))
    .sort()
    .map((file) => {
      const load = async (): Promise<Step> => (await import(pathToFileURL(join(dir, file)).href)) as Step
      return {
        name: file.replace(/\.ts$/, ''),
        up: async () => (await load()).up({ context: sequelize.getQueryInterface() }),
        down: async () => {
          const step = await load()
          if (step.down) await step.down({ context: sequelize.getQueryInterface() })
        },
      }
    })
}

/** Creates the Umzug runner for migrations (`kind: 'migrations'`) or seeders. */
export function createMigrator(sequelize: Sequelize, root: string, kind: 'migrations' | 'seeders') {
  return new Umzug({
    migrations: stepsIn(join(root, 'server', 'db', kind), sequelize),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, modelName: kind === 'migrations' ? 'SequelizeMeta' : 'SequelizeData' }),
    logger: undefined,
  })
}
