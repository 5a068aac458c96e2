#!/usr/bin/env node
// `npm test`: installs what is missing (npm packages, PostgreSQL, Chromium), starts a throwaway
// PostgreSQL cluster on a free loopback port, migrates and seeds it, then runs every test:
// typecheck, unit (vitest), build, API (vitest against the built server), browser (Playwright).
// Everything it started is stopped at the end, also on failure.
import { randomBytes } from 'node:crypto'
import { chmodSync, mkdtempSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import { spawn } from 'node:child_process'
import { ROOT, ensureChromium, ensureNodeModules, ensurePostgresBinaries, freePort, startChild, step, waitForHttp } from './lib/system.mjs'
import { buildIfStale, migrateAndSeed } from './lib/project.mjs'

const bin = (name) => join(ROOT, 'node_modules', '.bin', name)
const results = []
const cleanups = []

// Asynchronous on purpose: the SMTP fake runs in this process, and a blocking spawn would stop it
// from answering the app while the tests that wait for report e-mails are running.
async function runStep(name, cmd, args, env = {}) {
  step(`Test step: ${name}`)
  const started = Date.now()
  const child = spawn(cmd, args, { cwd: ROOT, stdio: 'inherit', env: { ...process.env, ...env } })
  const code = await new Promise((resolve) => {
    child.once('error', () => resolve(1))
    child.once('exit', (status) => resolve(status ?? 1))
  })
  const ok = code === 0
  results.push({ name, ok, seconds: (Date.now() - started) / 1000 })
  return ok
}

async function cleanup() {
  for (const fn of cleanups.reverse()) {
    try {
      await fn()
    } catch (error) {
      console.error(error)
    }
  }
  cleanups.length = 0
}
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, async () => { await cleanup(); process.exit(130) })

async function main() {
  const t0 = Date.now()
  ensureNodeModules()
  const pgBin = ensurePostgresBinaries()
  const chromium = ensureChromium()

  const tmp = mkdtempSync('/tmp/rimecase-test-')
  chmodSync(tmp, 0o755)
  cleanups.push(() => rmSync(tmp, { recursive: true, force: true }))
  const { startCluster } = await import('./lib/postgres.mjs')
  const cluster = await startCluster({ bin: pgBin, dataDir: join(tmp, 'pg'), port: await freePort(), database: 'rimecase_test' })
  cleanups.push(() => cluster.stop())
  migrateAndSeed(cluster.url)

  const sessionPassword = randomBytes(32).toString('hex')
  const common = { DATABASE_URL: cluster.url, CHROMIUM_PATH: chromium }
  await runStep('typecheck', bin('nuxt'), ['typecheck'])
  await runStep('unit tests', bin('vitest'), ['run', '--project', 'unit'], common)
  const built = await runStep('build', process.execPath, ['-e', 'import("./scripts/lib/project.mjs").then(m => m.buildIfStale())'])
  if (!built) return

  const { startSmtpFake } = await import('./lib/smtp.mjs')
  const outbox = join(tmp, 'outbox')
  const smtp = await startSmtpFake({ dir: outbox })
  cleanups.push(() => smtp.close())
  const appPort = await freePort()
  const baseUrl = `http://127.0.0.1:${appPort}`
  const app = startChild('app', process.execPath, ['.output/server/index.mjs'], {
    HOST: '127.0.0.1', PORT: String(appPort), NUXT_DATABASE_URL: cluster.url, NUXT_SESSION_PASSWORD: sessionPassword,
    NUXT_SMTP_PORT: String(smtp.port), NUXT_SMTP_OUTBOX_DIR: outbox, NUXT_UPLOAD_DIR: join(tmp, 'uploads'), NUXT_TEST_ROUTES: 'true',
  })
  cleanups.push(() => new Promise((resolve) => { if (app.exitCode !== null) return resolve(); app.once('exit', resolve); app.kill('SIGTERM') }))
  await waitForHttp(`${baseUrl}/api/health`)

  const served = { ...common, RIMECASE_TEST_BASE_URL: baseUrl, RIMECASE_OUTBOX_DIR: outbox }
  await runStep('API tests', bin('vitest'), ['run', '--project', 'api'], served)
  await runStep('browser tests', bin('playwright'), ['test'], served)
  console.log(`\nnpm test wall time: ${((Date.now() - t0) / 1000).toFixed(0)} s`)
}

main()
  .catch((error) => {
    console.error(`\nnpm test could not run: ${error instanceof Error ? error.stack : error}`)
    results.push({ name: 'set-up', ok: false, seconds: 0 })
  })
  .finally(async () => {
    await cleanup()
    console.log('\nTest steps:')
    for (const r of results) console.log(`  ${r.ok ? 'ok  ' : 'FAIL'} ${r.name} (${r.seconds.toFixed(1)} s)`)
    const failed = results.filter((r) => !r.ok).length
    console.log(`${results.length - failed} passed, ${failed} failed`)
    process.exit(failed ? 1 : 0)
  })
