#!/usr/bin/env node
// `npm run backup [-- --out <folder>]`: writes the database and the upload store into one new,
// timestamped folder (default .data/backups/rimecase-<UTC time>) and prints its path.
// The database is the one `npm start` uses: DATABASE_URL if set (environment or .env), else the
// embedded cluster under .data/postgres. A consistent snapshot is taken while the app runs.
import { parseArgs } from 'node:util'
import { ensureNodeModules } from './lib/system.mjs'
import { backup, openInstallation } from './lib/backup.mjs'

const { values } = parseArgs({ options: { out: { type: 'string', default: '.data/backups' }, 'upload-dir': { type: 'string' } } })

async function main() {
  ensureNodeModules()
  const target = await openInstallation({ uploadDir: values['upload-dir'] })
  try {
    const folder = await backup({ ...target, outDir: values.out })
    console.log(`Backup written to ${folder}`)
  } finally {
    await target.close()
  }
}

main().catch((error) => {
  console.error(`\nnpm run backup failed: ${error instanceof Error ? error.message : error}`)
  process.exit(1)
})
