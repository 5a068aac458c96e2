#!/usr/bin/env node
// `npm start`: installs what is missing, starts PostgreSQL (embedded under .data/postgres unless
// DATABASE_URL is set; it is watched and started again if it dies), migrates, builds and serves
// Rimecase on 127.0.0.1. Ctrl-C stops the app and PostgreSQL.
// The demo (organisations, people with a published password, history) is seeded only on the
// embedded database, or when asked for: `npm start -- --demo` or RIMECASE_DEMO=1 (`--no-demo` or
// RIMECASE_DEMO=0 leave it out of the embedded one too). Without the demo, the first administrator
// comes from RIMECASE_ADMIN_EMAIL / RIMECASE_ADMIN_PASSWORD, or a one-time set-up link is printed.
// Only Node built-ins are imported at the top: packages may not be installed yet.
import { existsSync, mkdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { ROOT, ensureNodeModules, ensurePostgresBinaries, portInUse, freePort, startChild, step, stopChild, waitForHttp } from './lib/system.mjs'
import { DEMO_SIGN_INS, buildIfStale, ensureFirstAdmin, ensureSessionSecret, migrateAndSeed } from './lib/project.mjs'

const DEFAULT_PG_PORT = 54329
const cleanups = []
let stopping = false

async function shutdown(code) {
  if (stopping) return
  stopping = true
  for (const cleanup of cleanups.reverse()) {
    try {
      await cleanup()
    } catch (error) {
      console.error(error)
    }
  }
  process.exit(code)
}
process.on('SIGINT', () => shutdown(0))
process.on('SIGTERM', () => shutdown(0))

/** Whether to seed the demo: asked for on the command line or in RIMECASE_DEMO, else only on the embedded database. */
function demoWanted(env, external) {
  const args = process.argv.slice(2)
  if (args.includes('--no-demo')) return false
  if (args.includes('--demo')) return true
  const setting = String(process.env.RIMECASE_DEMO ?? env.RIMECASE_DEMO ?? '').trim().toLowerCase()
  if (['1', 'true', 'yes', 'on'].includes(setting)) return true
  if (['0', 'false', 'no', 'off'].includes(setting)) return false
  return !external
}

async function database(env) {
  const url = process.env.DATABASE_URL || env.DATABASE_URL
  if (url) {
    step('Using the PostgreSQL given by DATABASE_URL')
    return { url, external: true }
  }
  const bin = ensurePostgresBinaries()
  const { startCluster, watchCluster } = await import('./lib/postgres.mjs')
  const dataDir = join(ROOT, '.data', 'postgres')
  mkdirSync(join(ROOT, '.data'), { recursive: true })
  const stateFile = join(dataDir, 'rimecase-cluster.json')
  const savedPort = existsSync(stateFile) ? JSON.parse(readFileSync(stateFile, 'utf8')).port : DEFAULT_PG_PORT
  const running = existsSync(join(dataDir, 'postmaster.pid'))
  const port = running || !(await portInUse(savedPort)) ? savedPort : await freePort()
  const cluster = await startCluster({ bin, dataDir, port })
  cleanups.push(() => cluster.stop())
  // If PostgreSQL dies while the app runs, it is started again; the app's requests answer 503 in
  // the meantime and its pool reconnects by itself. Ctrl-C ends the watch before the stop.
  const unwatch = watchCluster(cluster, { shouldRestart: () => !stopping, log: (message) => console.error(`[postgres] ${new Date().toISOString()} ${message}`) })
  cleanups.push(() => unwatch())
  return { url: cluster.url, external: false }
}

async function main() {
  const port = Number(process.env.PORT || 3000)
  const host = '127.0.0.1'
  if (await portInUse(port)) throw new Error(`Port ${port} on ${host} is already in use; stop what uses it or set PORT to another port`)
  ensureNodeModules()
  const env = ensureSessionSecret()
  const { url: databaseUrl, external } = await database(env)
  const demo = demoWanted(env, external)
  migrateAndSeed(databaseUrl, { seed: demo })
  const admin = demo ? null : ensureFirstAdmin(databaseUrl, env)
  // --no-build serves the build in .output as it is (made elsewhere, or by the test run).
  if (!process.argv.includes('--no-build')) buildIfStale()
  else if (!existsSync(join(ROOT, '.output', 'server', 'index.mjs'))) throw new Error('--no-build, but there is no build in .output; run npm run build first')

  const { startSmtpFake } = await import('./lib/smtp.mjs')
  // The fake writes the folder the app's Outbox page reads, so both get the same path.
  const outboxDir = process.env.NUXT_SMTP_OUTBOX_DIR || env.NUXT_SMTP_OUTBOX_DIR || join(ROOT, '.data', 'outbox')
  const smtp = await startSmtpFake({ port: Number(process.env.SMTP_PORT || env.SMTP_PORT || 0), dir: outboxDir })
  cleanups.push(() => smtp.close())

  const app = startChild('app', process.execPath, ['.output/server/index.mjs'], {
    ...env,
    HOST: host,
    PORT: String(port),
    NITRO_HOST: host,
    NITRO_PORT: String(port),
    NUXT_DATABASE_URL: databaseUrl,
    NUXT_SMTP_HOST: '127.0.0.1',
    NUXT_SMTP_PORT: String(smtp.port),
    NUXT_SMTP_OUTBOX_DIR: smtp.dir,
    NUXT_UPLOAD_DIR: process.env.NUXT_UPLOAD_DIR || env.NUXT_UPLOAD_DIR || join(ROOT, '.data', 'uploads'),
    NUXT_SESSION_PASSWORD: env.NUXT_SESSION_PASSWORD,
  })
  cleanups.push(() => stopChild(app))
  app.once('exit', (code) => {
    if (!stopping) {
      console.error(`The app stopped (exit ${code}).`)
      shutdown(code || 1)
    }
  })
  await waitForHttp(`http://${host}:${port}/api/health`)
  console.log(`\n  Rimecase is running at \x1b[1mhttp://${host}:${port}\x1b[0m`)
  console.log(`  Mail to customers is caught by the local SMTP fake on 127.0.0.1:${smtp.port} (Outbox page, admins).`)
  if (demo) {
    console.log('  Demo sign-ins (password: rimecase-demo):')
    for (const [role, email] of DEMO_SIGN_INS) console.log(`    ${email.padEnd(26)} ${role}`)
  } else if (admin.state === 'link') {
    const site = (process.env.NUXT_SITE_URL || env.NUXT_SITE_URL || `http://${host}:${port}`).replace(/\/$/, '')
    console.log('  No administrator yet. Open this one-time link to set up the first one')
    console.log(`  (it works once, until ${admin.expiresAt.replace('T', ' ').slice(0, 16)} UTC; a restart makes a new one):`)
    console.log(`\n    RIMECASE_SETUP_LINK ${site}/setup?token=${admin.token}\n`)
  } else if (admin.state === 'created') {
    console.log(`  Administrator ${admin.email} created from RIMECASE_ADMIN_EMAIL / RIMECASE_ADMIN_PASSWORD.`)
  }
  if (!demo && admin.demoAccounts.length) {
    console.log(`  \x1b[33mWarning:\x1b[0m this database holds demo sign-ins with the published password (${admin.demoAccounts.join(', ')}).`)
    console.log('  Deactivate them on the People page unless this is a demonstration.')
  }
  console.log('  Press Ctrl-C to stop the app and PostgreSQL.\n')
}

main().catch(async (error) => {
  console.error(`\nnpm start failed: ${error instanceof Error ? error.message : error}`)
  await shutdown(1)
})
