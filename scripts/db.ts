// Migration and seed CLI: `tsx --tsconfig tsconfig.scripts.json scripts/db.ts migrate|seed|status`.
// Reads DATABASE_URL from the environment (runtime config is not available outside Nitro).
import { createSequelize } from '#server/db/connection'
import { createMigrator } from '#server/db/migrator'

const ROOT = new URL('..', import.meta.url).pathname

async function main(command: string | undefined) {
  const url = process.env.DATABASE_URL
  if (!url) throw new Error('DATABASE_URL is not set')
  const sequelize = createSequelize(url)
  try {
    if (command === 'migrate') {
      const done = await createMigrator(sequelize, ROOT, 'migrations').up()
      console.log(`migrations: ${done.length} applied`)
    } else if (command === 'seed') {
      const done = await createMigrator(sequelize, ROOT, 'seeders').up()
      console.log(`seeders: ${done.length} applied${done.length ? ` (${done.map((d) => d.name).join(', ')})` : ' (demo already seeded)'}`)
    } else if (command === 'status') {
      const pending = await createMigrator(sequelize, ROOT, 'migrations').pending()
      console.log(`pending migrations: ${pending.map((p) => p.name).join(', ') || 'none'}`)
    } else {
      throw new Error('usage: db.ts migrate | seed | status')
    }
  } finally {
    await sequelize.close()
  }
}

main(process.argv[2]).catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
