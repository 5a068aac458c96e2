// Hostile bodies on every write route, generated with fast-check: the route list comes from the
// route files, so a new write route is fuzzed too (or fails here until it has a record to run on).
// Each route gets at least 200 bodies; none may get a 5xx, and a refused body (4xx) must leave
// every table as it was. Everything runs in an organisation made for it, so bodies that happen to
// be valid write only there.
import { randomUUID } from 'node:crypto'
import fc from 'fast-check'
import { QueryTypes, type Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { insertKnowledgeBaseVersion } from '#server/db/repositories/knowledge'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { ROUTE_RULES, WRITE_METHODS, type RecordKind, type RouteRule } from '#server/utils/route-rules'
import { routeFiles } from '../../route-files'
import { cascadeBody, customerWithSite } from '../equipment/fixtures'
import { ApiClient, BASE_URL, DEMO, DEMO_PASSWORD, signedIn } from '../helpers'
import { closeCase, openCase } from '../uploads/fixtures'
import { hostileBodiesForNone, hostileCsvBodies, hostileJsonBodies, hostileMultipartBodies, routeBodySchema, type WireBody } from './hostile-bodies'

const ROOT = new URL('../../..', import.meta.url).pathname
const RULES = ROUTE_RULES as Record<string, RouteRule>
/** Bodies per route (RIMECASE_FUZZ_RUNS raises it for a longer hunt; never below 200). */
const RUNS = Math.max(200, Number(process.env.RIMECASE_FUZZ_RUNS ?? 200))
/** A fixed seed, so a run is repeatable; RIMECASE_FUZZ_SEED=random (or a number) explores others. */
const SEED = process.env.RIMECASE_FUZZ_SEED === 'random' ? Date.now() % 2 ** 31 : Number(process.env.RIMECASE_FUZZ_SEED ?? 20261202)
/** Tables that change by themselves (sessions, counters, queues, the outbox) and are not compared. */
const RESTLESS = new Set(['rate_limits', 'user_sessions', 'background_jobs', 'outbound_emails', 'cache_stamps', 'SequelizeMeta', 'SequelizeData'])

const WRITE_ROUTES = [
  ...routeFiles(ROOT).filter((r) => WRITE_METHODS.has(r.method)).map((r) => ({ key: r.key, file: r.file as string | undefined })),
  ...Object.entries(RULES).filter(([key, rule]) => rule.providedBy && WRITE_METHODS.has(key.split(' ')[0]!)).map(([key]) => ({ key, file: undefined })),
]

let sequelize: Sequelize
let orgId: number
let admin: ApiClient
let tech: ApiClient
let fingerprintSql = ''
const records: Partial<Record<RecordKind, string>> = {}
let demoHash = ''
let itemKeys: Record<'causes' | 'tests' | 'findings', string>

const one = async <T>(sql: string, bind: unknown[] = []) => (await sequelize.query<T>(sql, { bind, type: QueryTypes.SELECT }))[0]

async function addUser(role: string, passwordHash: string): Promise<{ id: number; email: string }> {
  const email = `hostile-${role}-${randomUUID().slice(0, 8)}@hostile.test`
  const row = await one<{ id: number }>(
    `INSERT INTO users (organisation_id, email, name, role, password_hash, active, created_at, updated_at)
     VALUES ($1, $2, $3, $4, $5, true, now(), now()) RETURNING id`, [orgId, email, `Hostile ${role}`, role, passwordHash])
  return { id: row!.id, email }
}

/** Row counts, newest change and lock versions of every table of the database but the restless ones. */
async function fingerprint(): Promise<Record<string, string>> {
  return (await one<Record<string, string>>(fingerprintSql))!
}

async function jobsSettled() {
  for (let i = 0; i < 100; i++) {
    const busy = await one<{ n: string }>(`SELECT count(*) AS n FROM background_jobs WHERE state IN ('queued', 'running')`)
    if (busy!.n === '0') return
    await new Promise((r) => setTimeout(r, 100))
  }
}

/** A case of the organisation with one reading, one test result and one repair step, so index 0 names each. */
async function caseWithEntries(): Promise<string> {
  const opened = await openCase(admin, 'Hostile input: cabinet warm')
  const id = opened.id
  const steps = [
    await admin.post(`/api/cases/${id}/readings`, { readings: [{ quantity: 'cabinetTemperature', value: -60, unit: 'C' }] }),
    await admin.post(`/api/cases/${id}/test-results`, { test: 'standing-pressure-check', stage: 'low', outcome: 'low' }),
    await admin.post(`/api/cases/${id}/steps`, { step: { kind: 'evacuation', stage: 'low', vacuumUnit: 'micron', target: 500, reached: 350, decayMinutes: 15, afterDecay: 600 } }),
  ]
  for (const res of steps) expect(res.status, JSON.stringify(res.body)).toBe(200)
  return String(id)
}

/** A technician of the organisation, signed in. */
async function freshPerson(): Promise<ApiClient> {
  return signedIn((await addUser('technician', demoHash)).email, DEMO_PASSWORD)
}

async function freshContact(): Promise<string> {
  const made = await admin.post(`/api/sites/${records.sites}/contacts`, { name: 'Hostile Contact', email: `contact-${randomUUID().slice(0, 8)}@hostile.test`, receivesReports: true })
  expect(made.status, JSON.stringify(made.body)).toBe(201)
  return String(made.body.id)
}

beforeAll(async () => {
  sequelize = createSequelize(process.env.DATABASE_URL!)
  demoHash = (await one<{ password_hash: string }>('SELECT password_hash FROM users WHERE email = $1', [DEMO.admin]))!.password_hash
  const org = await one<{ id: number }>(
    `INSERT INTO organisations (name, slug, created_at, updated_at) VALUES ('Hostile Input Lab', $1, now(), now()) RETURNING id`, [`hostile-${randomUUID().slice(0, 8)}`])
  orgId = org!.id
  await sequelize.transaction((transaction) =>
    insertKnowledgeBaseVersion(orgId, loadKnowledgeBaseFromDirectory(`${ROOT}content-src`), { label: 'Seed base', status: 'published' }, transaction))
  const adminUser = await addUser('admin', demoHash)
  const techUser = await addUser('technician', demoHash)
  records.users = String((await addUser('technician', demoHash)).id)
  admin = await signedIn(adminUser.email, DEMO_PASSWORD)
  tech = await signedIn(techUser.email, DEMO_PASSWORD)

  // Equipment, a closed case for an exercise, an attempt, a logger file, a knowledge-base draft and a sent report.
  const made = await customerWithSite(admin, 'Hostile Input Customer')
  records.customers = String(made.customerId)
  records.sites = String(made.siteId)
  const unit = await admin.post('/api/units', cascadeBody(made.siteId))
  expect(unit.status, JSON.stringify(unit.body)).toBe(201)
  records.units = String(unit.body.id)
  records.contacts = await freshContact()
  const past = await openCase(admin, 'Hostile input: closed case')
  await closeCase(admin, past.id)
  const exercise = await admin.post('/api/exercises', { caseId: past.id, title: 'Hostile input exercise' })
  expect(exercise.status, JSON.stringify(exercise.body)).toBe(201)
  records.exercises = String(exercise.body.id)
  const attempt = await tech.post(`/api/exercises/${exercise.body.id}/attempts`)
  expect(attempt.status, JSON.stringify(attempt.body)).toBe(201)
  records['exercise-attempts'] = String(attempt.body.id)
  const reportCase = await openCase(admin, 'Hostile input: report and logger file')
  const logger = await admin.request('POST', `/api/cases/${reportCase.id}/logger-files?name=hostile.csv`,
    'time,cabinet\n2026-01-01 10:00,-80\n2026-01-01 10:01,-80\n2026-01-01 10:02,-80\n', { headers: { 'content-type': 'text/csv' } })
  expect(logger.status, JSON.stringify(logger.body)).toBe(201)
  records['logger-files'] = String(logger.body.id)
  const draft = await admin.post('/api/knowledge-base/versions', { label: 'Hostile input draft' })
  expect(draft.status, JSON.stringify(draft.body)).toBe(201)
  records['kb-versions'] = String(draft.body.id)
  const content = (await admin.get(`/api/knowledge-base/versions/${draft.body.id}/content`)).body
  itemKeys = {
    causes: content.causes[0].slug,
    tests: content.tests[0].slug,
    findings: content.findings[0].finding.name,
  }
  const sent = await admin.post(`/api/cases/${reportCase.id}/report/send`, { to: (await one<{ email: string }>('SELECT email FROM contacts WHERE id = $1', [records.contacts]))!.email })
  expect(sent.status, JSON.stringify(sent.body)).toBe(202)
  records.emails = String((await one<{ id: number }>('SELECT id FROM outbound_emails WHERE organisation_id = $1 ORDER BY id DESC LIMIT 1', [orgId]))!.id)

  const columns = await sequelize.query<{ table_name: string; column_name: string }>(
    `SELECT c.table_name, c.column_name FROM information_schema.columns c JOIN information_schema.tables t USING (table_schema, table_name)
     WHERE c.table_schema = 'public' AND t.table_type = 'BASE TABLE' ORDER BY c.table_name`, { type: QueryTypes.SELECT })
  const tables = new Map<string, Set<string>>()
  for (const c of columns) if (!RESTLESS.has(c.table_name)) tables.set(c.table_name, (tables.get(c.table_name) ?? new Set()).add(c.column_name))
  fingerprintSql = `SELECT ${[...tables].map(([table, cols]) => `(SELECT count(*)::text${cols.has('updated_at') ? ` || '/' || coalesce(max(updated_at)::text, '')` : ''}${cols.has('lock_version') ? ` || '/' || coalesce(sum(lock_version)::text, '')` : ''} FROM "${table}") AS "${table}"`).join(', ')}`
  await jobsSettled()
}, 180_000)

afterAll(async () => {
  // Sign-in failures counted against the loopback address must not hold up the tests that follow.
  await sequelize?.query('DELETE FROM rate_limits')
  await sequelize?.close()
})

async function pathFor(path: string, rule: RouteRule): Promise<string> {
  let result = path
  for (const [param, kind] of Object.entries(rule.records ?? {})) {
    let value: string | undefined
    if (kind === 'cases') value = await caseWithEntries()
    else if (kind === 'contacts') value = await freshContact()
    else if (kind === 'index') value = /\/(causes|tests|findings)\/\[/.exec(path) ? itemKeys[/\/(causes|tests|findings)\/\[/.exec(path)![1] as keyof typeof itemKeys] : '0'
    else value = records[kind]
    if (value === undefined) throw new Error(`no ${kind} record to fuzz ${path} with: add one to the hostile-input set-up`)
    result = result.replace(`[${param}]`, encodeURIComponent(value))
  }
  return result
}

async function send(client: ApiClient, method: string, path: string, wire: WireBody): Promise<{ status: number } | { error: string }> {
  const headers: Record<string, string> = { accept: 'application/json', cookie: client.cookie }
  if (wire.contentType) headers['content-type'] = wire.contentType
  try {
    const res = await fetch(`${BASE_URL}${path}`, { method, headers, body: wire.body, redirect: 'manual', signal: AbortSignal.timeout(20_000) })
    await res.arrayBuffer()
    return { status: res.status }
  } catch (error) {
    const cause = error instanceof Error && error.cause instanceof Error ? ` (${(error.cause as NodeJS.ErrnoException).code ?? error.cause.name}: ${error.cause.message})` : ''
    return { error: error instanceof Error ? `${error.name}: ${error.message}${cause}` : String(error) }
  }
}

describe('hostile bodies on every write route', () => {
  it('finds the write routes in the route files', () => {
    expect(WRITE_ROUTES.length).toBeGreaterThan(40)
    expect(WRITE_ROUTES.filter((r) => !RULES[r.key]).map((r) => r.key)).toEqual([])
  })

  it('refuses record numbers beyond the id column in a body with 400, not a database error', async () => {
    const huge = Number.MAX_SAFE_INTEGER
    const caseId = Number(await caseWithEntries())
    const probes: [string, string, unknown][] = [
      ['POST', `/api/units/${records.units}/refrigerant-log`, { stage: 'high', refrigerant: 'R290', grams: 5, direction: 'added', caseId: huge }],
      ['POST', `/api/units/${records.units}/compliance-checks`, { kind: 'repair', stage: 'high', passed: true, caseId: huge }],
      ['POST', `/api/units/${records.units}/nameplate`, { stage: 'low', refrigerant: 'R170', basis: 'mass', caseId: huge }],
      ['POST', '/api/cases', { unitId: huge, complaint: 'Cabinet warm' }],
      ['PUT', `/api/cases/${caseId}/report/photos`, { uploadIds: [huge] }],
      ['POST', '/api/exercises', { caseId: huge, title: 'Out of range' }],
      ['PUT', `/api/exercises/${records.exercises}/assignees`, { userIds: [2 ** 31] }],
    ]
    const before = await fingerprint()
    const wrong: string[] = []
    for (const [method, path, body] of probes) {
      const res = await admin.request(method, path, body)
      if (res.status !== 400) wrong.push(`${method} ${path}: ${res.status} ${JSON.stringify(res.body?.message)}`)
    }
    expect(wrong).toEqual([])
    expect(await fingerprint()).toEqual(before)
  })

  it(`answers ${RUNS} hostile bodies per route without a 5xx, and a refused body writes nothing`, async () => {
    const problems: string[] = []
    let requests = 0
    const started = Date.now()
    console.log(`hostile bodies: ${WRITE_ROUTES.length} write routes × ${RUNS} bodies, fast-check seed ${SEED} (RIMECASE_FUZZ_SEED=${SEED} repeats it)`)
    for (const [n, route] of WRITE_ROUTES.entries()) {
      const rule = RULES[route.key]!
      const [method, template] = route.key.split(' ') as [string, string]
      const path = await pathFor(template, rule)
      const schema = route.file ? await routeBodySchema(ROOT, route.file) : undefined
      const kind = rule.body ?? 'json'
      const arbitrary = kind === 'multipart' ? hostileMultipartBodies : kind === 'csv' ? hostileCsvBodies : kind === 'none' ? hostileBodiesForNone : hostileJsonBodies(schema)
      const bodies = fc.sample(arbitrary, { numRuns: RUNS, seed: SEED + n })
      // Signing out ends the session it is sent with: that (public) route runs as a person of its own.
      const endsSession = route.key === 'POST /api/auth/logout' || route.key === 'DELETE /api/_auth/session'
      const client = endsSession ? await freshPerson() : rule.personal ? tech : admin
      const t0 = Date.now()
      let before = await fingerprint()
      const statuses = new Map<number, number>()
      for (const [i, wire] of bodies.entries()) {
        // A rate-limited route would answer 429 before reading most bodies: its counters start afresh now and then.
        if (rule.limit && i % 20 === 19) await sequelize.query('DELETE FROM rate_limits')
        const res = await send(client, method, path, wire)
        requests++
        const preview = typeof wire.body === 'string' ? JSON.stringify(wire.body.slice(0, 160)) : '(form)'
        if ('error' in res) {
          problems.push(`${route.key} [${wire.what}] ${preview}: no answer (${res.error})`)
          continue
        }
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1)
        if (res.status >= 500) problems.push(`${route.key} [${wire.what}] ${preview}: ${res.status}`)
        if (res.status >= 400 && res.status < 500) {
          const after = await fingerprint()
          const changed = Object.keys(after).filter((t) => after[t] !== before[t])
          if (changed.length) problems.push(`${route.key} [${wire.what}] ${preview}: ${res.status} but wrote to ${changed.join(', ')}`)
          before = after
        } else {
          // An accepted body wrote what it may; its jobs finish before the next comparison.
          await jobsSettled()
          before = await fingerprint()
        }
      }
      // Rate limits counted by this route (sign-in failures, account changes) start afresh for the next.
      await sequelize.query('DELETE FROM rate_limits')
      console.log(`  ${route.key}: ${[...statuses].sort((a, b) => a[0] - b[0]).map(([s, c]) => `${s}×${c}`).join(' ')}${schema ? '' : ' (no zod schema found: generic bodies)'} in ${((Date.now() - t0) / 1000).toFixed(1)} s`)
    }
    console.log(`hostile bodies: ${requests} requests in ${((Date.now() - started) / 1000).toFixed(0)} s`)
    // Server errors and dropped connections first, then writes left by refused bodies.
    const listed = [...problems.filter((p) => /: (5\d\d|no answer.*)$/.test(p)), ...problems.filter((p) => !/: (5\d\d|no answer.*)$/.test(p))]
    expect(listed.slice(0, 40), `${problems.length} problems`).toEqual([])
    expect(requests).toBeGreaterThanOrEqual(WRITE_ROUTES.length * 200)
  }, 1_500_000)
})
