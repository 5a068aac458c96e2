// A throwaway Rimecase stack for tests and benchmarks: PostgreSQL in a temporary folder on a free
// loopback port (migrated and seeded), the SMTP fake, and the built server. `stop()` ends all of it.
import { randomBytes } from 'node:crypto'
import { chmodSync, mkdtempSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import { ensurePostgresBinaries, freePort, startChild, stopChild, waitForHttp } from './system.mjs'
import { migrateAndSeed } from './project.mjs'

/** Starts PostgreSQL (migrated and seeded); returns { tmp, databaseUrl, cluster, stop } (cluster: see startCluster). */
export async function startDatabase(prefix = 'rimecase-') {
  const pgBin = ensurePostgresBinaries()
  const tmp = mkdtempSync(`/tmp/${prefix}`)
  chmodSync(tmp, 0o755)
  const { startCluster } = await import('./postgres.mjs')
  const cluster = await startCluster({ bin: pgBin, dataDir: join(tmp, 'pg'), port: await freePort(), database: 'rimecase_test' })
  try {
    migrateAndSeed(cluster.url)
  } catch (error) {
    cluster.stop()
    rmSync(tmp, { recursive: true, force: true })
    throw error
  }
  return {
    tmp,
    databaseUrl: cluster.url,
    cluster,
    stop: () => {
      cluster.stop()
      rmSync(tmp, { recursive: true, force: true })
    },
  }
}

/** Starts the SMTP fake and the built server against `databaseUrl`; returns { baseUrl, outbox, stop }. */
export async function startServer({ tmp, databaseUrl }) {
  const { startSmtpFake } = await import('./smtp.mjs')
  const outbox = join(tmp, 'outbox')
  const smtp = await startSmtpFake({ dir: outbox })
  const port = await freePort()
  const app = startChild('app', process.execPath, ['.output/server/index.mjs'], {
    HOST: '127.0.0.1', PORT: String(port), NUXT_DATABASE_URL: databaseUrl, NUXT_SESSION_PASSWORD: randomBytes(32).toString('hex'),
    NUXT_SMTP_PORT: String(smtp.port), NUXT_SMTP_OUTBOX_DIR: outbox, NUXT_UPLOAD_DIR: join(tmp, 'uploads'), NUXT_TEST_ROUTES: 'true',
  })
  const baseUrl = `http://127.0.0.1:${port}`
  const stop = async () => {
    await stopChild(app)
    await smtp.close()
  }
  try {
    await waitForHttp(`${baseUrl}/api/health`)
  } catch (error) {
    await stop()
    throw error
  }
  return { baseUrl, outbox, stop }
}
