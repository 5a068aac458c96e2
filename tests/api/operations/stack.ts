// A throwaway stack of its own for the tests that break things on purpose (kill the server, stop
// PostgreSQL, restore a backup over the data): a fresh migrated and seeded cluster in a temporary
// folder, and the built server on it, so the shared test database is never touched.
import { join } from 'node:path'
// @ts-expect-error: plain JavaScript shared with `npm start` and `npm test`
import { startDatabase } from '../../../scripts/lib/harness.mjs'
import { startApp, type AppProcess } from '../app-process'

export interface Cluster {
  url: string
  port: number
  stop(): void
  start(): void
  running(): boolean
  pid(): number | null
}

export interface OwnDatabase {
  tmp: string
  databaseUrl: string
  cluster: Cluster
  stop(): void
}

export const ROOT = new URL('../../..', import.meta.url).pathname

/** A fresh cluster with the schema and the demo; about half a minute on this machine. */
export function ownDatabase(): Promise<OwnDatabase> {
  return startDatabase('rimecase-ops-')
}

/** The built server on `db`, its uploads in the database's temporary folder. */
export function appOn(db: OwnDatabase, readyStatus = 200): Promise<AppProcess> {
  return startApp({ NUXT_DATABASE_URL: db.databaseUrl, NUXT_UPLOAD_DIR: uploadDirOf(db) }, readyStatus)
}

export const uploadDirOf = (db: OwnDatabase) => join(db.tmp, 'uploads')

/** Kills the server and its workers at once, as a power cut or the OOM killer would. */
export async function killHard(app: AppProcess): Promise<void> {
  if (app.child.exitCode !== null || app.child.signalCode !== null) return
  const exited = new Promise((resolve) => app.child.once('exit', resolve))
  process.kill(-app.child.pid!, 'SIGKILL')
  await exited
}
