// Backup and restore of a Rimecase installation: the database (pg_dump's custom format) and the
// upload store (a tar of its folder), side by side in one timestamped folder with a manifest of
// checksums. Used by `npm run backup` and `npm run restore`, for the embedded PostgreSQL that
// `npm start` runs and for an external DATABASE_URL alike.
import { createHash } from 'node:crypto'
import { spawnSync } from 'node:child_process'
import { createReadStream, existsSync, mkdirSync, readFileSync, readdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { ROOT, ensurePostgresBinaries, step } from './system.mjs'
import { readDotEnv } from './project.mjs'

export const FORMAT = 'rimecase-backup/1'
const DUMP = 'database.dump'
const UPLOADS = 'uploads.tar'
const MANIFEST = 'manifest.json'

/**
 * Where the installation keeps its data: DATABASE_URL (environment, then .env) or the embedded
 * cluster under .data/postgres, started for the while if it is not running; and the upload folder.
 * Returns { databaseUrl, uploadDir, close }.
 */
export async function openInstallation({ databaseUrl, uploadDir } = {}) {
  const env = readDotEnv()
  uploadDir = resolve(ROOT, uploadDir || process.env.NUXT_UPLOAD_DIR || env.NUXT_UPLOAD_DIR || join('.data', 'uploads'))
  const driver = process.env.NUXT_UPLOAD_DRIVER || env.NUXT_UPLOAD_DRIVER || 'fs'
  if (driver !== 'fs') console.warn(`The upload store is "${driver}", not a folder: back up its bucket with that service's own tools.`)
  const url = databaseUrl || process.env.DATABASE_URL || env.DATABASE_URL
  if (url) return { databaseUrl: url, uploadDir, uploadsInFolder: driver === 'fs', close: () => {} }
  const dataDir = join(ROOT, '.data', 'postgres')
  const stateFile = join(dataDir, 'rimecase-cluster.json')
  if (!existsSync(stateFile)) throw new Error('No database: set DATABASE_URL, or run `npm start` once to create the embedded one')
  const { startCluster } = await import('./postgres.mjs')
  const wasRunning = existsSync(join(dataDir, 'postmaster.pid'))
  const cluster = await startCluster({ bin: ensurePostgresBinaries(), dataDir, port: JSON.parse(readFileSync(stateFile, 'utf8')).port })
  return { databaseUrl: cluster.url, uploadDir, uploadsInFolder: driver === 'fs', close: () => (wasRunning ? undefined : cluster.stop()) }
}

/** pg_dump/pg_restore take the password from the environment, not from the command line. */
function pgArgs(databaseUrl) {
  const url = new URL(databaseUrl)
  const env = { ...process.env, PGPASSWORD: decodeURIComponent(url.password) }
  url.password = ''
  return { env, dbname: url.toString() }
}

function runTool(cmd, args, env) {
  const result = spawnSync(cmd, args, { cwd: ROOT, env, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 })
  if (result.status !== 0) throw new Error(`${cmd.split('/').pop()} failed (${result.status ?? result.signal}):\n${result.stderr || result.stdout}`)
  return result.stdout
}

function sha256(path) {
  return new Promise((resolvePromise, reject) => {
    const hash = createHash('sha256')
    createReadStream(path).on('data', (c) => hash.update(c)).on('error', reject).on('end', () => resolvePromise(hash.digest('hex')))
  })
}

function countFiles(dir) {
  if (!existsSync(dir)) return 0
  return readdirSync(dir, { withFileTypes: true }).reduce((n, e) => n + (e.isDirectory() ? countFiles(join(dir, e.name)) : 1), 0)
}

const stamp = (date) => date.toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z')

/** Writes one backup into a new folder under `outDir`; returns its path. */
export async function backup({ databaseUrl, uploadDir, uploadsInFolder = true, outDir, now = new Date() }) {
  const bin = ensurePostgresBinaries()
  const folder = join(resolve(ROOT, outDir), `rimecase-${stamp(now)}`)
  if (existsSync(folder)) throw new Error(`${folder} already exists`)
  mkdirSync(folder, { recursive: true, mode: 0o700 })
  try {
    step(`Dumping the database to ${join(folder, DUMP)}`)
    const { env, dbname } = pgArgs(databaseUrl)
    // Custom format: compressed, and pg_restore can recreate it in one transaction. Owners and
    // grants are left out so it restores under any role that owns the target database.
    runTool(join(bin, 'pg_dump'), ['--format=custom', '--no-owner', '--no-acl', '--file', join(folder, DUMP), '--dbname', dbname], env)
    step(`Packing the upload store ${uploadDir}`)
    const hasUploads = uploadsInFolder && existsSync(uploadDir)
    const tarArgs = hasUploads ? ['-C', uploadDir, '-cf', join(folder, UPLOADS), '.'] : ['-cf', join(folder, UPLOADS), '-T', '/dev/null']
    runTool('tar', tarArgs, process.env)
    const manifest = {
      format: FORMAT,
      createdAt: now.toISOString(),
      database: { file: DUMP, bytes: statSync(join(folder, DUMP)).size, sha256: await sha256(join(folder, DUMP)) },
      uploads: { file: UPLOADS, files: hasUploads ? countFiles(uploadDir) : 0, bytes: statSync(join(folder, UPLOADS)).size, sha256: await sha256(join(folder, UPLOADS)) },
    }
    writeFileSync(join(folder, MANIFEST), `${JSON.stringify(manifest, null, 2)}\n`, { mode: 0o600 })
    return folder
  } catch (error) {
    rmSync(folder, { recursive: true, force: true })
    throw error
  }
}

/** Reads and checks a backup folder: the manifest's format and both files' checksums. */
export async function readArchive(folder) {
  const manifestFile = join(folder, MANIFEST)
  if (!existsSync(manifestFile)) throw new Error(`${folder} is not a Rimecase backup (no ${MANIFEST})`)
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8'))
  if (manifest.format !== FORMAT) throw new Error(`${folder} has format ${manifest.format}; this version reads ${FORMAT}`)
  for (const part of [manifest.database, manifest.uploads]) {
    const path = join(folder, part.file)
    if (!existsSync(path) || (await sha256(path)) !== part.sha256) throw new Error(`${path} is missing or damaged (checksum differs)`)
  }
  return manifest
}

/** What the target already holds: its tables (outside PostgreSQL's own schemas) and upload files. */
export async function existingData({ databaseUrl, uploadDir }) {
  const { default: pg } = await import('pg')
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect()
  try {
    const { rows } = await client.query(
      `SELECT count(*)::int AS n FROM pg_tables WHERE schemaname NOT IN ('pg_catalog', 'information_schema') AND schemaname NOT LIKE 'pg_toast%'`,
    )
    return { tables: rows[0].n, uploadFiles: countFiles(uploadDir) }
  } finally {
    await client.end()
  }
}

/** Schemas the dump creates, besides public (which every database has). */
function dumpedSchemas(bin, dumpFile) {
  const list = runTool(join(bin, 'pg_restore'), ['--list', dumpFile], process.env)
  return [...list.matchAll(/^\d+; \d+ \d+ SCHEMA - (\S+) /gm)].map((m) => m[1]).filter((s) => s !== 'public')
}

/**
 * Puts a backup back: refuses when the database has tables or the upload folder has files, unless
 * `force`. The database is emptied (public and the dump's own schemas) and restored in one
 * transaction; the upload folder in place before is kept beside it, renamed, not deleted.
 */
export async function restore({ folder, databaseUrl, uploadDir, uploadsInFolder = true, force = false }) {
  const bin = ensurePostgresBinaries()
  const manifest = await readArchive(folder)
  const before = await existingData({ databaseUrl, uploadDir })
  if ((before.tables || before.uploadFiles) && !force) {
    throw new RefusedError(
      `The target is not empty (${before.tables} tables in the database, ${before.uploadFiles} files in ${uploadDir}). ` +
        'Restoring replaces all of it; run again with --force to do that.',
    )
  }
  const dumpFile = join(folder, manifest.database.file)
  const schemas = dumpedSchemas(bin, dumpFile)
  const { default: pg } = await import('pg')
  const client = new pg.Client({ connectionString: databaseUrl, application_name: 'rimecase-restore' })
  await client.connect()
  try {
    // A running app keeps connections open (its job worker polls every second): replacing the
    // database under it would mix old and new records, so the restore waits for it to be stopped.
    const { rows } = await client.query(
      `SELECT coalesce(nullif(application_name, ''), 'unnamed') AS name, count(*)::int AS n FROM pg_stat_activity
        WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_type = 'client backend' GROUP BY 1 ORDER BY 1`,
    )
    const others = rows.reduce((sum, r) => sum + r.n, 0)
    if (others) {
      throw new RefusedError(
        `The database is in use: ${others} other connection${others === 1 ? '' : 's'} (${rows.map((r) => `${r.n} × ${r.name}`).join(', ')}). ` +
          'Stop the app (and close anything else connected to it) before restoring.',
      )
    }
    step('Emptying the database')
    const quoted = (s) => `"${s.replace(/"/g, '""')}"`
    await client.query('BEGIN')
    for (const schema of schemas) await client.query(`DROP SCHEMA IF EXISTS ${quoted(schema)} CASCADE`)
    await client.query('DROP SCHEMA IF EXISTS public CASCADE')
    await client.query('CREATE SCHEMA public')
    await client.query('COMMIT')
  } finally {
    await client.end()
  }
  step('Restoring the database')
  const { env, dbname } = pgArgs(databaseUrl)
  runTool(join(bin, 'pg_restore'), ['--no-owner', '--no-acl', '--single-transaction', '--exit-on-error', '--dbname', dbname, dumpFile], env)
  let keptAside = null
  if (uploadsInFolder) {
    step(`Restoring the upload store into ${uploadDir}`)
    const incoming = `${uploadDir}.restoring-${process.pid}`
    rmSync(incoming, { recursive: true, force: true })
    mkdirSync(incoming, { recursive: true })
    runTool('tar', ['-C', incoming, '-xf', join(folder, manifest.uploads.file)], process.env)
    if (existsSync(uploadDir)) {
      keptAside = `${uploadDir}.before-restore-${stamp(new Date())}`
      if (countFiles(uploadDir)) renameSync(uploadDir, keptAside)
      else {
        rmSync(uploadDir, { recursive: true, force: true })
        keptAside = null
      }
    }
    mkdirSync(dirname(uploadDir), { recursive: true })
    renameSync(incoming, uploadDir)
  }
  return { manifest, keptAside }
}

/** A restore that would overwrite data without --force. */
export class RefusedError extends Error {}
