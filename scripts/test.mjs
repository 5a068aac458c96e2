#!/usr/bin/env node
// `npm test`: installs what is missing (npm packages, PostgreSQL, Chromium), starts a throwaway
// PostgreSQL cluster on a free loopback port, migrates and seeds it, then runs every test:
// typecheck, unit and component (vitest), build, API (vitest against the built server, with a
// second server on the same database for the cache checks), browser (Playwright).
// Everything it started is stopped at the end, also on failure.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { ROOT, ensureChromium, ensureNodeModules, ensurePostgresBinaries, step } from './lib/system.mjs'
import { startDatabase, startServer } from './lib/harness.mjs'

const bin = (name) => join(ROOT, 'node_modules', '.bin', name)
const results = []
const cleanups = []

// Steps run asynchronously: the SMTP fake lives in this process and must keep answering while
// the API and browser tests send mail through the app.
// RIMECASE_TEST_STEPS=api,browser runs only the named steps (typecheck, unit, component, build, api,
// browser) while working on one part; `npm test` and CI run them all.
const only = (process.env.RIMECASE_TEST_STEPS ?? '').split(',').map((s) => s.trim().toLowerCase()).filter(Boolean)
const wanted = (name) => !only.length || only.some((w) => name.toLowerCase().startsWith(w))
// RIMECASE_TEST_FILTER=cases,report passes file filters to vitest and Playwright, to run only the
// test files whose path contains one of them.
const filters = (process.env.RIMECASE_TEST_FILTER ?? '').split(',').map((s) => s.trim()).filter(Boolean)
const vitestFilters = filters.length ? ['--passWithNoTests', ...filters] : []
const playwrightFilters = filters.length ? ['--pass-with-no-tests', ...filters] : []

async function runStep(name, cmd, args, env = {}) {
  if (!wanted(name) && name !== 'build') {
    console.log(`(skipping ${name}: RIMECASE_TEST_STEPS=${only.join(',')})`)
    return true
  }
  step(`Test step: ${name}`)
  const started = Date.now()
  const child = spawn(cmd, args, { cwd: ROOT, stdio: 'inherit', env: { ...process.env, ...env } })
  const code = await new Promise((resolve) => {
    child.once('error', () => resolve(1))
    child.once('exit', (c) => resolve(c ?? 1))
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
  ensurePostgresBinaries()
  const chromium = ensureChromium()

  const db = await startDatabase('rimecase-test-')
  cleanups.push(() => db.stop())
  const common = { DATABASE_URL: db.databaseUrl, CHROMIUM_PATH: chromium }
  await runStep('typecheck', bin('nuxt'), ['typecheck'])
  await runStep('unit tests', bin('vitest'), ['run', '--project', 'unit', ...vitestFilters], common)
  await runStep('component tests', bin('vitest'), ['run', '--project', 'nuxt', ...vitestFilters], common)
  const built = await runStep('build', process.execPath, ['-e', 'import("./scripts/lib/project.mjs").then(m => m.buildIfStale())'])
  if (!built) return

  const server = await startServer(db)
  cleanups.push(() => server.stop())
  const baseUrl = server.baseUrl
  const outbox = server.outbox

  const served = { ...common, RIMECASE_TEST_BASE_URL: baseUrl, RIMECASE_OUTBOX_DIR: outbox }
  // A second server on the same database: the cache checks change data through one and read it
  // through the other. It is stopped before the browser tests to leave them the machine.
  const second = await startServer(db)
  await runStep('API tests', bin('vitest'), ['run', '--project', 'api', ...vitestFilters], { ...served, RIMECASE_TEST_SECOND_BASE_URL: second.baseUrl })
  await second.stop()
  await runStep('browser tests', bin('playwright'), ['test', ...playwrightFilters], served)
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
