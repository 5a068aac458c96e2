#!/usr/bin/env node
// `npm run restore -- <backup folder> [--force]`: puts a backup made by `npm run backup` back into
// the database and upload store `npm start` uses. Stop the app first: it refuses while anything is
// connected to the database. It refuses to overwrite a
// database with tables or an upload folder with files unless --force is given; the upload folder
// it replaces is kept beside the new one, renamed.
import { parseArgs } from 'node:util'
import { ensureNodeModules } from './lib/system.mjs'
import { RefusedError, openInstallation, restore } from './lib/backup.mjs'

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { force: { type: 'boolean', default: false }, 'upload-dir': { type: 'string' } },
})

async function main() {
  if (positionals.length !== 1) {
    console.error('Usage: npm run restore -- <backup folder> [--force]')
    process.exit(2)
  }
  ensureNodeModules()
  const target = await openInstallation({ uploadDir: values['upload-dir'] })
  try {
    const { manifest, keptAside } = await restore({ ...target, folder: positionals[0], force: values.force })
    console.log(`Restored the backup of ${manifest.createdAt} (${manifest.uploads.files} upload files).`)
    if (keptAside) console.log(`The upload folder that was there is kept at ${keptAside}.`)
  } finally {
    await target.close()
  }
}

main().catch((error) => {
  console.error(`\nnpm run restore ${error instanceof RefusedError ? 'refused' : 'failed'}: ${error instanceof Error ? error.message : error}`)
  process.exit(error instanceof RefusedError ? 3 : 1)
})
