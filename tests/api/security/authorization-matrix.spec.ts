// The authorization matrix, generated from the route files: every route is called anonymously and
// as every role of the records' own organisation and of another organisation. A route the rules
// table does not name fails here first, with the line to add.
import { randomUUID } from 'node:crypto'
import { QueryTypes, type Sequelize } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createSequelize } from '#server/db/connection'
import { ROUTE_RULES, RECORD_TABLES, rulePermissions, type RecordKind, type RouteRule } from '#server/utils/route-rules'
import { ROLES, can, type Role } from '#shared/utils/permissions'
import { routeFiles } from '../../route-files'
import { ApiClient, DEMO, DEMO_PASSWORD, signedIn } from '../helpers'
import { fileForm, openCase, samplePng } from '../uploads/fixtures'

const ROOT = new URL('../../..', import.meta.url).pathname
const RULES = ROUTE_RULES as Record<string, RouteRule>
const ROUTES = routeFiles(ROOT).filter((r) => r.key !== '* /api/[...]')

interface Actor {
  name: string
  role: Role | null
  org: 'own' | 'other' | null
  email: string | null
  client: ApiClient
}

let sequelize: Sequelize
let ownOrg: number
const actors: Actor[] = []
/** One record of each kind in the own organisation (contacts are made fresh for each call that may delete one). */
const ownRecords: Partial<Record<RecordKind, string>> = {}

const one = async <T>(sql: string, bind: unknown[]) => (await sequelize.query<T>(sql, { bind, type: QueryTypes.SELECT }))[0]

async function freshContact(): Promise<string> {
  const site = await one<{ id: number }>('SELECT id FROM sites WHERE organisation_id = $1 ORDER BY id LIMIT 1', [ownOrg])
  const row = await one<{ id: number }>(
    `INSERT INTO contacts (organisation_id, site_id, name, email, phone, receives_reports, created_at, updated_at)
     VALUES ($1, $2, 'Matrix Contact', $3, '', false, now(), now()) RETURNING id`,
    [ownOrg, site!.id, `matrix-${randomUUID().slice(0, 8)}@example.test`],
  )
  return String(row!.id)
}

async function waitFor<T>(read: () => Promise<T | undefined>, what: string): Promise<T> {
  for (let i = 0; i < 150; i++) {
    const value = await read()
    if (value !== undefined) return value
    await new Promise((r) => setTimeout(r, 200))
  }
  throw new Error(`timed out waiting for ${what}`)
}

beforeAll(async () => {
  sequelize = createSequelize(process.env.DATABASE_URL!)
  const orgOf = async (email: string) => (await one<{ organisation_id: number; password_hash: string }>(
    'SELECT organisation_id, password_hash FROM users WHERE email = $1', [email]))!
  const own = await orgOf(DEMO.tech)
  const other = await orgOf(DEMO.otherTech)
  ownOrg = own.organisation_id
  // The other organisation gets one user of each role (same password as the demo accounts).
  const otherEmails: Record<Role, string> = { technician: DEMO.otherTech, engineer: '', trainer: '', admin: '' }
  for (const role of ROLES.filter((r) => r !== 'technician')) {
    const email = `matrix-${role}-${randomUUID().slice(0, 8)}@bluefen.demo`
    await sequelize.query(
      `INSERT INTO users (organisation_id, email, name, role, password_hash, active, created_at, updated_at)
       VALUES ($1, $2, $3, $4, $5, true, now(), now())`,
      { bind: [other.organisation_id, email, `Matrix ${role}`, role, other.password_hash] },
    )
    otherEmails[role] = email
  }
  const ownEmails: Record<Role, string> = { technician: DEMO.tech, engineer: DEMO.engineer, trainer: DEMO.trainer, admin: DEMO.admin }
  actors.push({ name: 'anonymous', role: null, org: null, email: null, client: new ApiClient() })
  for (const role of ROLES) {
    actors.push({ name: `${role} of the organisation`, role, org: 'own', email: ownEmails[role], client: await signedIn(ownEmails[role], DEMO_PASSWORD) })
    actors.push({ name: `${role} of another organisation`, role, org: 'other', email: otherEmails[role], client: await signedIn(otherEmails[role], DEMO_PASSWORD) })
  }

  // Records of the own organisation: a case with a photo and a sent report, so that every kind exists.
  const tech = actors.find((a) => a.role === 'technician' && a.org === 'own')!.client
  const opened = await openCase(tech, 'Authorization matrix case')
  const photo = await tech.post(`/api/units/${opened.unitId}/uploads`, fileForm(await samplePng(), 'matrix.png', 'image/png'))
  expect(photo.status).toBe(201)
  const contact = await one<{ email: string }>(
    'SELECT c.email FROM contacts c JOIN units u ON u.site_id = c.site_id WHERE u.id = $1 ORDER BY c.id LIMIT 1', [opened.unitId])
  const sent = await tech.post(`/api/cases/${opened.id}/report/send`, contact ? { to: contact.email } : {})
  expect(sent.status).toBe(202)
  ownRecords.cases = String(opened.id)
  ownRecords.units = String(opened.unitId)
  ownRecords.uploads = String(photo.body.id)
  // A training exercise from a closed case, and an attempt at it.
  const trainer = actors.find((a) => a.role === 'trainer' && a.org === 'own')!.client
  const closed = await one<{ id: number }>(`SELECT id FROM cases WHERE organisation_id = $1 AND status = 'closed' ORDER BY id LIMIT 1`, [ownOrg])
  const exercise = await trainer.post('/api/exercises', { caseId: closed!.id, title: 'Authorization matrix exercise' })
  expect(exercise.status).toBe(201)
  const attempt = await tech.post(`/api/exercises/${exercise.body.id}/attempts`)
  expect(attempt.status).toBe(201)
  // A data-logger file on the case, and a cylinder record.
  const logger = await tech.request('POST', `/api/cases/${opened.id}/logger-files?name=matrix.csv`, 'time,cabinet\n2026-01-01 10:00,-80\n2026-01-01 10:01,-80\n2026-01-01 10:02,-80\n', { headers: { 'content-type': 'text/csv' } })
  expect(logger.status).toBe(201)
  ownRecords['logger-files'] = String(logger.body.id)
  const cylinder = await tech.post('/api/cylinders', { label: `MATRIX-${randomUUID().slice(0, 8)}` })
  expect(cylinder.status).toBe(201)
  ownRecords.cylinders = String(cylinder.body.id)
  ownRecords.exercises = String(exercise.body.id)
  ownRecords['exercise-attempts'] = String(attempt.body.id)
  for (const kind of ['sites', 'customers', 'users', 'emails', 'jobs', 'kb-versions'] as const) {
    const order = RECORD_TABLES[kind].id === 'uuid' ? 'created_at DESC' : 'id DESC'
    const row = await one<{ id: string | number }>(`SELECT id FROM ${RECORD_TABLES[kind].table} WHERE organisation_id = $1 ORDER BY ${order} LIMIT 1`, [ownOrg])
    ownRecords[kind] = String(row!.id)
  }
  const admin = actors.find((a) => a.role === 'admin' && a.org === 'own')!.client
  ownRecords['outbox-message'] = await waitFor(async () => {
    // The outbox answers one page of messages ({ items, total, … }).
    const page = (await admin.get('/api/outbox')).body as { items: { id: string }[] }
    return page.items?.[0]?.id
  }, 'the report e-mail in the outbox')
  ownRecords.global = 'R23'
  ownRecords.index = '0'
}, 120_000)

afterAll(async () => {
  await sequelize?.close()
})

async function pathFor(path: string, rule: RouteRule): Promise<string> {
  let result = path
  for (const [param, kind] of Object.entries(rule.records ?? {})) {
    const value = kind === 'contacts' ? await freshContact() : ownRecords[kind]
    if (value === undefined) throw new Error(`no ${kind} record to call ${path} with`)
    result = result.replace(`[${param}]`, encodeURIComponent(value))
  }
  return result
}

/**
 * What the rules say this actor must get: a status, 'through' (passed authorization: anything but
 * 401, 403, 404), or 'inside' (the organisation's own: the service may still answer 404 for a key
 * within the record that is not there, or 403/404 for a record personal to someone else).
 */
function expected(rule: RouteRule, actor: Actor): 401 | 403 | 404 | 'through' | 'inside' {
  if (rule.allow === 'public') return 'through'
  if (!actor.role) return 401
  const needs = rulePermissions(rule)
  if (needs.length && !needs.some((p) => can(actor.role, p))) return 403
  const scoped = Object.values(rule.records ?? {}).some((kind) => kind in RECORD_TABLES || kind === 'outbox-message')
  if (actor.org === 'other' && scoped) return 404
  const inner = rule.personal || Object.values(rule.records ?? {}).includes('index')
  return inner ? 'inside' : 'through'
}

describe('authorization matrix', () => {
  it('has a rule for every route file', () => {
    const missing = ROUTES.filter((r) => !RULES[r.key]).map((r) =>
      `${r.file}: add '${r.key}': { allow: … } to ROUTE_RULES in server/utils/route-rules.ts`)
    expect(missing).toEqual([])
  })

  it('every route answers every caller as its rule says', async () => {
    const wrong: string[] = []
    let calls = 0
    for (const route of ROUTES) {
      const rule = RULES[route.key]
      if (!rule) continue
      for (const actor of actors) {
        const path = await pathFor(route.path, rule)
        const body = route.method === 'GET' || route.method === 'DELETE' || rule.body === 'multipart' || rule.body === 'csv' ? undefined : {}
        const res = await actor.client.request(route.method, path, body)
        calls++
        const want = expected(rule, actor)
        const ok = want === 'through' ? ![401, 403, 404].includes(res.status) && res.status < 500
          : want === 'inside' ? res.status !== 401 && res.status < 500
            : res.status === want
        // Signing out ends the actor's session: sign in again for the next routes.
        if (route.key === 'POST /api/auth/logout' && actor.email) actor.client = await signedIn(actor.email, DEMO_PASSWORD)
        if (!ok) wrong.push(`${route.key} as ${actor.name}: ${res.status}, expected ${typeof want === 'number' ? want : 'to pass authorization'}`)
      }
    }
    expect(wrong).toEqual([])
    expect(calls).toBeGreaterThanOrEqual(ROUTES.length * 9)
  }, 300_000)

  it('refuses ids beyond the column range and unknown API paths with 404', async () => {
    const tech = actors.find((a) => a.role === 'technician' && a.org === 'own')!.client
    for (const id of ['2147483648', '99999999999999999999', '4294967297']) {
      expect((await tech.get(`/api/cases/${id}`)).status, id).toBe(404)
      expect((await tech.post(`/api/cases/${id}/notes`, { text: 'x' })).status, id).toBe(404)
      expect((await tech.get(`/api/units/${id}`)).status, id).toBe(404)
    }
    expect((await tech.get('/api/cases/abc')).status).toBe(400)
    expect((await tech.get('/api/no-such-route')).status).toBe(404)
    expect((await tech.request('DELETE', `/api/cases/${ownRecords.cases}`)).status).toBe(404)
  })
})
