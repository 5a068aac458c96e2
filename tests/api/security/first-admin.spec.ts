// `npm start` against an external database that did not ask for the demo: no demo sign-ins exist,
// the first administrator comes from RIMECASE_ADMIN_EMAIL / RIMECASE_ADMIN_PASSWORD, or else the
// printed set-up link creates one, once. Each case runs the real start script on a fresh database.
import { spawn, type ChildProcess } from 'node:child_process'
import { randomBytes } from 'node:crypto'
import { mkdtempSync, readFileSync, rmSync, chmodSync } from 'node:fs'
import { createServer } from 'node:net'
import { join } from 'node:path'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, DEMO_PASSWORD } from '../helpers'

const ROOT = new URL('../../..', import.meta.url).pathname
const ADMIN_PASSWORD = 'Cascade-Stage-7 north'

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer()
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number }
      server.close(() => resolve(port))
    })
    server.on('error', reject)
  })
}

let tmp: string
let cluster: { url: string; port: number; stop: () => void }
let superPassword: string

async function superQuery(database: string, sql: string, params: unknown[] = []) {
  const client = new pg.Client({ host: '127.0.0.1', port: cluster.port, user: 'postgres', password: superPassword, database })
  await client.connect()
  try {
    return (await client.query(sql, params)).rows
  } finally {
    await client.end()
  }
}

/** A fresh, empty database in the throwaway cluster; returns its URL. */
async function freshDatabase(name: string): Promise<string> {
  await superQuery('postgres', `CREATE DATABASE ${name} OWNER rimecase`)
  return cluster.url.replace(/\/[^/]+$/, `/${name}`)
}

interface Started { baseUrl: string; output: string; child: ChildProcess }
const running: ChildProcess[] = []

/** Runs `npm start` (scripts/start.mjs) on `databaseUrl` until it has printed its whole banner. */
async function start(databaseUrl: string, env: Record<string, string> = {}, args: string[] = []): Promise<Started> {
  const port = await freePort()
  const base = { ...process.env }
  for (const key of ['RIMECASE_ADMIN_EMAIL', 'RIMECASE_ADMIN_PASSWORD', 'RIMECASE_ADMIN_NAME', 'RIMECASE_ORG_NAME', 'RIMECASE_DEMO', 'NUXT_SITE_URL']) delete base[key]
  // The test run built the app already; sources edited since must not set off a second build here.
  const child = spawn(process.execPath, ['scripts/start.mjs', '--no-build', ...args], {
    cwd: ROOT,
    env: {
      ...base, DATABASE_URL: databaseUrl, PORT: String(port), NUXT_SESSION_PASSWORD: randomBytes(32).toString('hex'),
      NUXT_SMTP_OUTBOX_DIR: join(tmp, `outbox-${port}`), NUXT_UPLOAD_DIR: join(tmp, `uploads-${port}`), SMTP_PORT: '0', NITRO_CLUSTER_WORKERS: '1', ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  running.push(child)
  let output = ''
  child.stdout!.on('data', (c) => { output += c.toString() })
  child.stderr!.on('data', (c) => { output += c.toString() })
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`npm start did not come up:\n${output}`)), 170_000)
    const check = () => {
      // The banner's last line: everything about sign-ins (the set-up link among it) was printed.
      if (output.includes('Press Ctrl-C')) {
        clearTimeout(timer)
        resolve()
      }
    }
    child.stdout!.on('data', check)
    child.once('exit', (code) => {
      clearTimeout(timer)
      reject(new Error(`npm start exited with ${code}:\n${output}`))
    })
  })
  return { baseUrl: `http://127.0.0.1:${port}`, output, child }
}

async function stop(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return
  const exited = new Promise((r) => child.once('exit', r))
  child.kill('SIGTERM')
  const force = setTimeout(() => child.kill('SIGKILL'), 30_000)
  await exited
  clearTimeout(force)
}

beforeAll(async () => {
  tmp = mkdtempSync('/tmp/rimecase-first-admin-')
  chmodSync(tmp, 0o755)
  const { startCluster } = await import(new URL('../../../scripts/lib/postgres.mjs', import.meta.url).href)
  const { ensurePostgresBinaries } = await import(new URL('../../../scripts/lib/system.mjs', import.meta.url).href)
  cluster = await startCluster({ bin: ensurePostgresBinaries(), dataDir: join(tmp, 'pg'), port: await freePort(), database: 'rimecase_first' })
  superPassword = JSON.parse(readFileSync(join(tmp, 'pg', 'rimecase-cluster.json'), 'utf8')).superPassword
}, 120_000)

afterAll(async () => {
  for (const child of running) await stop(child)
  cluster?.stop()
  rmSync(tmp, { recursive: true, force: true })
}, 120_000)

const demoEmails = Object.values(DEMO)

describe('npm start on an external database without the demo', () => {
  it('creates the administrator named in the environment and no demo sign-in', async () => {
    const url = await freshDatabase('rimecase_env_admin')
    const app = await start(url, { RIMECASE_ADMIN_EMAIL: 'Chief@Service.example', RIMECASE_ADMIN_PASSWORD: ADMIN_PASSWORD, RIMECASE_ADMIN_NAME: 'Ilse Brandvold', RIMECASE_ORG_NAME: 'Northfrost Service' })
    try {
      expect(app.output).toContain('Administrator chief@service.example created')
      expect(app.output).not.toContain('rimecase-demo')
      const users = await superQuery('rimecase_env_admin', 'SELECT email, role, active FROM users ORDER BY id')
      expect(users).toEqual([{ email: 'chief@service.example', role: 'admin', active: true }])
      expect(await superQuery('rimecase_env_admin', 'SELECT name FROM organisations')).toEqual([{ name: 'Northfrost Service' }])
      // The organisation can rank from the start: the knowledge base is published.
      expect(await superQuery('rimecase_env_admin', "SELECT count(*)::int AS n FROM kb_versions WHERE status = 'published'")).toEqual([{ n: 1 }])
      for (const email of demoEmails) {
        expect((await new ApiClient(app.baseUrl).post('/api/auth/login', { email, password: DEMO_PASSWORD })).status, email).toBe(401)
      }
      const admin = new ApiClient(app.baseUrl)
      const signIn = await admin.post('/api/auth/login', { email: 'chief@service.example', password: ADMIN_PASSWORD })
      expect(signIn.status).toBe(200)
      expect(signIn.body.user.role).toBe('admin')
      expect((await admin.get('/api/admin/users')).status).toBe(200)
    } finally {
      await stop(app.child)
    }
    // A second start finds the administrator and changes nothing.
    const again = await start(url, { RIMECASE_ADMIN_EMAIL: 'someone.else@service.example', RIMECASE_ADMIN_PASSWORD: ADMIN_PASSWORD })
    await stop(again.child)
    expect(again.output).not.toContain('RIMECASE_SETUP_LINK')
    expect(await superQuery('rimecase_env_admin', 'SELECT count(*)::int AS n FROM users')).toEqual([{ n: 1 }])
  }, 400_000)

  it('refuses a weak administrator password from the environment', async () => {
    const url = await freshDatabase('rimecase_weak_admin')
    await expect(start(url, { RIMECASE_ADMIN_EMAIL: 'chief@service.example', RIMECASE_ADMIN_PASSWORD: 'password12' })).rejects.toThrow(/RIMECASE_ADMIN_PASSWORD is too weak/)
    expect(await superQuery('rimecase_weak_admin', 'SELECT count(*)::int AS n FROM users')).toEqual([{ n: 0 }])
  }, 200_000)

  it('prints a one-time set-up link that creates the first administrator once and only once', async () => {
    const url = await freshDatabase('rimecase_setup_link')
    const app = await start(url)
    try {
      expect(await superQuery('rimecase_setup_link', 'SELECT count(*)::int AS n FROM users')).toEqual([{ n: 0 }])
      const link = /RIMECASE_SETUP_LINK (\S+)/.exec(app.output)?.[1]
      expect(link, app.output).toMatch(/\/setup\?token=[A-Za-z0-9_-]{43}$/)
      const token = new URL(link!).searchParams.get('token')!
      // Only a hash of the secret is stored.
      const stored = await superQuery('rimecase_setup_link', 'SELECT token_hash FROM setup_links')
      expect(stored).toHaveLength(1)
      expect(stored[0].token_hash).not.toContain(token)
      const anonymous = new ApiClient(app.baseUrl)
      expect((await anonymous.get(`/api/setup?token=${token}`)).status).toBe(200)
      expect((await anonymous.get(`/api/setup?token=${'x'.repeat(43)}`)).status).toBe(404)
      expect((await anonymous.get('/api/setup?token=short')).status).toBe(400)
      // The page itself is open to the link's holder.
      const page = await fetch(link!.replace(/^http:\/\/[^/]+/, app.baseUrl), { redirect: 'manual' })
      expect(page.status).toBe(200)

      const body = { token, organisation: 'Harrowgate Cold Service', name: 'Tomas Vinterberg', email: 'first@cold.example', password: ADMIN_PASSWORD }
      const weak = await anonymous.post('/api/setup', { ...body, password: 'aaaaaaaaaaaa' })
      expect(weak.status).toBe(400)
      expect(JSON.stringify(weak.body)).toContain('password')
      // An expired link does not work (and a refused attempt did not use it up).
      await superQuery('rimecase_setup_link', "UPDATE setup_links SET expires_at = now() - interval '1 minute'")
      expect((await anonymous.post('/api/setup', body)).status).toBe(404)
      await superQuery('rimecase_setup_link', "UPDATE setup_links SET expires_at = now() + interval '1 hour'")

      // Two uses at the same moment: exactly one succeeds.
      const [a, b] = await Promise.all([anonymous.post('/api/setup', body), anonymous.post('/api/setup', { ...body, email: 'second@cold.example' })])
      expect([a.status, b.status].sort()).toEqual([201, 404])
      const created = a.status === 201 ? a : b
      expect(created.body.user.role).toBe('admin')
      const again = await anonymous.post('/api/setup', { ...body, email: 'third@cold.example' })
      expect(again.status).toBe(404)
      expect(again.body.message).toMatch(/used already or has expired/)
      expect((await anonymous.get(`/api/setup?token=${token}`)).status).toBe(404)

      const users = await superQuery('rimecase_setup_link', 'SELECT email, name, role FROM users')
      expect(users).toEqual([{ email: created.body.user.email, name: 'Tomas Vinterberg', role: 'admin' }])
      expect(await superQuery('rimecase_setup_link', 'SELECT name FROM organisations')).toEqual([{ name: 'Harrowgate Cold Service' }])
      const admin = new ApiClient(app.baseUrl)
      expect((await admin.post('/api/auth/login', { email: created.body.user.email, password: ADMIN_PASSWORD })).status).toBe(200)
      for (const email of demoEmails) {
        expect((await new ApiClient(app.baseUrl).post('/api/auth/login', { email, password: DEMO_PASSWORD })).status, email).toBe(401)
      }
    } finally {
      await stop(app.child)
    }
    // With an administrator in place, a restart prints no new link.
    const again = await start(url)
    await stop(again.child)
    expect(again.output).not.toContain('RIMECASE_SETUP_LINK')
  }, 500_000)
})
