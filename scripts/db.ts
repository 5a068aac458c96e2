// Migration and seed CLI: `tsx --tsconfig tsconfig.scripts.json scripts/db.ts migrate|seed|status`.
// Reads DATABASE_URL from the environment (runtime config is not available outside Nitro).
import { createSequelize } from '#server/db/connection'
import { ensureFirstAdmin, firstAdminSettingsFrom } from '#server/db/first-admin'
import { createMigrator } from '#server/db/migrator'
import { demoAccountsPresent } from '#server/db/repositories/first-admin'
import { DEMO_ORGANISATIONS } from '#server/db/seeders/demo-equipment'
import { Organisation } from '#server/db/models'
import { insertKnowledgeBaseVersion } from '#server/db/repositories/knowledge'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { CONTENT_DIR } from '#server/db/seeders/20261202030200-import-knowledge-base'

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
    } else if (command === 'first-admin') {
      // A deployment without the demo: the administrator from RIMECASE_ADMIN_* or a one-time set-up
      // link. The outcome is the last line of output, as JSON, for npm start to print.
      const outcome = await ensureFirstAdmin(sequelize, firstAdminSettingsFrom(process.env))
      const demoAccounts = await demoAccountsPresent(DEMO_ORGANISATIONS.flatMap((o) => o.users.map((u) => u.email)))
      console.log(JSON.stringify({ ...outcome, demoAccounts }))
    } else if (command === 'kb-import') {
      // Validates content-src and stores it as a new version of every organisation (or one, with
      // --org <slug>): a draft by default, the published one with --publish. Safe to repeat.
      const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
      const publish = process.argv.includes('--publish')
      const slug = process.argv[process.argv.indexOf('--org') + 1]
      const orgs = await Organisation.findAll({ where: process.argv.includes('--org') && slug ? { slug } : {} })
      const label = `content-src ${new Date().toISOString().slice(0, 16).replace('T', ' ')}`
      for (const org of orgs) {
        const version = await sequelize.transaction((t) => insertKnowledgeBaseVersion(org.id, source, { label, status: publish ? 'published' : 'draft' }, t))
        console.log(`${org.slug}: version ${version.id} (${version.status}), ${source.causes.length} causes, ${source.tests.length} tests, ${source.rules.length} rules`)
      }
    } else if (command === 'status') {
      const pending = await createMigrator(sequelize, ROOT, 'migrations').pending()
      console.log(`pending migrations: ${pending.map((p) => p.name).join(', ') || 'none'}`)
    } else {
      throw new Error('usage: db.ts migrate | seed | first-admin | status | kb-import [--publish] [--org <slug>]')
    }
  } finally {
    await sequelize.close()
  }
}

main(process.argv[2]).catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
