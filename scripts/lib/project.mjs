// Project steps shared by `npm start` and `npm test`: environment file, migrations, seed, build.
import { randomBytes } from 'node:crypto'
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { ROOT, run, step } from './system.mjs'

/** Reads KEY=value lines of .env into an object (no interpolation). */
export function readDotEnv() {
  const file = join(ROOT, '.env')
  if (!existsSync(file)) return {}
  return Object.fromEntries(
    readFileSync(file, 'utf8')
      .split('\n')
      .map((l) => l.trim())
      .filter((l) => l && !l.startsWith('#') && l.includes('='))
      .map((l) => [l.slice(0, l.indexOf('=')).trim(), l.slice(l.indexOf('=') + 1).trim().replace(/^"|"$/g, '')]),
  )
}

/**
 * Makes sure there is a session secret of 32+ characters: NUXT_SESSION_PASSWORD from the
 * environment, or from .env (written with a new random one when missing); returns the merged environment.
 */
export function ensureSessionSecret() {
  const env = readDotEnv()
  if (process.env.NUXT_SESSION_PASSWORD && process.env.NUXT_SESSION_PASSWORD.length >= 32) {
    env.NUXT_SESSION_PASSWORD = process.env.NUXT_SESSION_PASSWORD
  } else if (!env.NUXT_SESSION_PASSWORD || env.NUXT_SESSION_PASSWORD.length < 32) {
    const secret = randomBytes(32).toString('hex')
    const file = join(ROOT, '.env')
    const before = existsSync(file) ? readFileSync(file, 'utf8') : ''
    writeFileSync(file, `${before}${before && !before.endsWith('\n') ? '\n' : ''}NUXT_SESSION_PASSWORD=${secret}\n`, { mode: 0o600 })
    step('Wrote a new random session secret to .env')
    env.NUXT_SESSION_PASSWORD = secret
  }
  return env
}

const tsx = (args, env, options = {}) =>
  run(join(ROOT, 'node_modules', '.bin', 'tsx'), ['--tsconfig', 'tsconfig.scripts.json', ...args], { env: { ...process.env, ...env }, ...options })

/** Applies pending migrations, then the seeders (each runs once). */
export function migrateAndSeed(databaseUrl, { seed = true } = {}) {
  step('Migrating the database')
  tsx(['scripts/db.ts', 'migrate'], { DATABASE_URL: databaseUrl })
  if (seed) {
    step('Seeding the demo')
    tsx(['scripts/db.ts', 'seed'], { DATABASE_URL: databaseUrl })
  }
}

/**
 * A deployment without the demo: makes sure an administrator exists (from RIMECASE_ADMIN_EMAIL /
 * RIMECASE_ADMIN_PASSWORD, or a one-time set-up link). Returns { state, email?, token?, expiresAt?,
 * demoAccounts } (scripts/db.ts first-admin).
 */
export function ensureFirstAdmin(databaseUrl, dotEnv = {}) {
  step('Checking for an administrator')
  const output = tsx(['scripts/db.ts', 'first-admin'], { ...dotEnv, ...process.env, DATABASE_URL: databaseUrl }, { stdio: ['ignore', 'pipe', 'inherit'], encoding: 'utf8' })
  const last = output.trim().split('\n').at(-1)
  return JSON.parse(last)
}

function newestMtime(dir) {
  let newest = 0
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue
    const path = join(dir, entry.name)
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(path) : statSync(path).mtimeMs)
  }
  return newest
}

/** Builds the production server unless .output is newer than every source. */
export function buildIfStale({ force = false } = {}) {
  const marker = join(ROOT, '.output', 'nitro.json')
  const sources = ['app', 'server', 'shared', 'public', 'content-src'].filter((d) => existsSync(join(ROOT, d)))
  const newestSource = Math.max(
    ...sources.map((d) => newestMtime(join(ROOT, d))),
    ...['nuxt.config.ts', 'package-lock.json', 'tailwind.config.ts'].filter((f) => existsSync(join(ROOT, f))).map((f) => statSync(join(ROOT, f)).mtimeMs),
  )
  if (!force && existsSync(marker) && statSync(marker).mtimeMs > newestSource) {
    step('Production build is up to date')
    return
  }
  step('Building the app (nuxt build)')
  run(join(ROOT, 'node_modules', '.bin', 'nuxt'), ['build'], { env: { ...process.env, NODE_ENV: 'production' } })
}

export const DEMO_SIGN_INS = [
  ['technician', 'tech@rimecase.demo'],
  ['engineer', 'engineer@rimecase.demo'],
  ['trainer', 'trainer@rimecase.demo'],
  ['admin', 'admin@rimecase.demo'],
  ['technician, second organisation', 'tech@bluefen.demo'],
]
