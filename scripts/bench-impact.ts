/**
 * Impact of a knowledge-base version on past cases, against a running Rimecase and its database
 * (run by `npm run bench` on its throwaway stack; RIMECASE_BENCH_BASE_URL and DATABASE_URL).
 *
 * Generates a history of RIMECASE_BENCH_IMPACT_CASES (10,000) closed cases with confirmed causes on
 * the demo organisation's units (the demo's fault scenarios, one noise seed per case), stores it
 * straight in the database, then asks the server as an engineer would: a draft is started, and
 * POST /api/knowledge-base/versions/{id}/impact queues the replay that GET /api/jobs/{id} follows.
 * Prints, for a draft against the published version (two rankings a case) and for the published
 * version alone, the time from the request to the finished job, the job's own run time, cases per
 * second, and the server's CPU time meanwhile (the rest of the wall time is other work on the machine).
 */
import { readFileSync, readdirSync } from 'node:fs'
import { availableParallelism, loadavg } from 'node:os'
import type { CreationAttributes } from 'sequelize'
import { createSequelize } from '#server/db/connection'
import { Organisation, ServiceCase, User } from '#server/db/models'
import { findUnits } from '#server/db/repositories/equipment'
import { generatedHistory } from './lib/generated-history'

const BASE = process.env.RIMECASE_BENCH_BASE_URL ?? 'http://127.0.0.1:3000'
const CASES = Number(process.env.RIMECASE_BENCH_IMPACT_CASES ?? 10_000)
const TARGET_S = 10
const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')

/** CPU seconds (user + system) used so far by the app server listening on BASE's port: its primary and every worker. */
function serverCpuSeconds(): number | null {
  const port = new URL(BASE).port
  let total = 0
  let found = false
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8')
      const env = readFileSync(`/proc/${pid}/environ`, 'utf8')
      if (!cmd.includes('.output/server/index.mjs') || !env.includes(`PORT=${port}\0`)) continue
      const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ')
      // utime and stime are fields 14 and 15 of stat, in clock ticks (100 a second on Linux).
      total += (Number(fields[11]) + Number(fields[12])) / 100
      found = true
    } catch {
      // A process that ended or is not ours to read.
    }
  }
  return found ? total : null
}

async function storeHistory(): Promise<number> {
  const sequelize = createSequelize(url!)
  try {
    const org = await Organisation.findOne({ where: { slug: 'rimecase-demo' } })
    if (!org) throw new Error('the demo organisation is missing')
    const technician = await User.findOne({ where: { organisationId: org.id, role: 'technician' }, order: [['id', 'ASC']] })
    const units = await findUnits(org.id)
    const t0 = performance.now()
    let rows: CreationAttributes<ServiceCase>[] = []
    let stored = 0
    const flush = async () => {
      if (rows.length) await ServiceCase.bulkCreate(rows, { validate: false })
      stored += rows.length
      rows = []
    }
    for (const c of generatedHistory(units, CASES, new Date(), technician?.id ?? null)) {
      rows.push({
        organisationId: org.id, unitId: c.unitId, technicianId: technician?.id ?? null, status: 'closed', complaint: c.complaint,
        symptoms: c.symptoms, readings: c.readings, testResults: c.testResults, ranking: null, closure: c.closure,
        confirmedCauses: c.confirmedCauses, openedAt: c.openedAt, closedAt: c.closedAt,
      })
      if (rows.length === 500) await flush()
    }
    await flush()
    const [{ n }] = (await sequelize.query(
      `SELECT count(*)::int AS n FROM cases WHERE organisation_id = ${org.id} AND status = 'closed' AND jsonb_array_length(confirmed_causes) > 0`,
    ))[0] as [{ n: number }]
    console.log(`generated history: ${stored.toLocaleString('en-US')} closed cases with confirmed causes on ${units.length} units, stored in ${((performance.now() - t0) / 1000).toFixed(1)} s; the organisation now has ${n.toLocaleString('en-US')}`)
    return n
  } finally {
    await sequelize.close()
  }
}

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'rimecase-demo' }) })
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`)
  return res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))!.split(';')[0]!
}

interface Job { state: string; progress: number; error: string | null; result: { cases: number; candidate: { top1: number; top3: number }; published: { top1: number; top3: number }; changedFirst: number[] } | null }

async function replay(cookie: string, versionId: number, what: string, jobTimes: (jobId: string) => Promise<{ started: Date; finished: Date } | null>) {
  const headers = { cookie, 'content-type': 'application/json' }
  const cpu0 = serverCpuSeconds()
  const t0 = performance.now()
  const res = await fetch(`${BASE}/api/knowledge-base/versions/${versionId}/impact`, { method: 'POST', headers })
  if (res.status !== 202) throw new Error(`impact request failed: ${res.status} ${await res.text()}`)
  const { jobId } = (await res.json()) as { jobId: string }
  let job: Job | null = null
  let polls = 0
  // Bounded: gives up after two minutes.
  for (let i = 0; i < 1200; i++) {
    job = (await (await fetch(`${BASE}/api/jobs/${jobId}`, { headers })).json()) as Job
    polls++
    if (job.state === 'done' || job.state === 'failed') break
    await new Promise((r) => setTimeout(r, 100))
  }
  const wall = (performance.now() - t0) / 1000
  const cpu1 = serverCpuSeconds()
  if (job?.state !== 'done' || !job.result) throw new Error(`impact job ${jobId} ended ${job?.state}: ${job?.error}`)
  const times = await jobTimes(jobId)
  const run = times ? (times.finished.getTime() - times.started.getTime()) / 1000 : null
  const r = job.result
  const pct = (x: number) => `${(x * 100).toFixed(1)} %`
  console.log(`${what}: ${r.cases.toLocaleString('en-US')} cases`)
  console.log(`  request to finished job ${wall.toFixed(2)} s (${Math.round(r.cases / wall).toLocaleString('en-US')} cases/s; target <= ${TARGET_S} s for 10,000)` +
    `${run !== null ? `; the job itself ran ${run.toFixed(2)} s (${Math.round(r.cases / run).toLocaleString('en-US')} cases/s)` : ''}`)
  const cpu = cpu0 !== null && cpu1 !== null ? cpu1 - cpu0 : null
  console.log(`  server CPU meanwhile ${cpu !== null ? `${cpu.toFixed(2)} s (${Math.round(r.cases / cpu).toLocaleString('en-US')} cases per CPU second)` : 'not readable'}; ${polls} polls of GET /api/jobs/{id}; load average ${loadavg()[0]!.toFixed(1)} on ${availableParallelism()} cores`)
  console.log(`  top-1 ${pct(r.candidate.top1)} / published ${pct(r.published.top1)}; top-3 ${pct(r.candidate.top3)} / published ${pct(r.published.top3)}; first cause changed in ${r.changedFirst.length} cases`)
}

const total = await storeHistory()
if (total < CASES) throw new Error(`only ${total} cases stored`)
const cookie = await signIn('engineer@rimecase.demo')
const headers = { cookie, 'content-type': 'application/json' }
const versions = (await (await fetch(`${BASE}/api/knowledge-base/versions`, { headers })).json()) as { id: number; status: string }[]
const published = versions.find((v) => v.status === 'published')
if (!published) throw new Error('no published version')
const draft = (await (await fetch(`${BASE}/api/knowledge-base/versions`, { method: 'POST', headers, body: JSON.stringify({ label: 'Impact benchmark draft' }) })).json()) as { id: number }

const sequelize = createSequelize(url)
const jobTimes = async (jobId: string) => {
  const [row] = (await sequelize.query('SELECT started_at, finished_at FROM background_jobs WHERE id = :jobId', { replacements: { jobId } }))[0] as { started_at: Date | null; finished_at: Date | null }[]
  return row?.started_at && row.finished_at ? { started: new Date(row.started_at), finished: new Date(row.finished_at) } : null
}
try {
  await replay(cookie, draft.id, `impact of draft ${draft.id} against published version ${published.id} (two rankings a case)`, jobTimes)
  await replay(cookie, published.id, `impact of published version ${published.id} alone (one ranking a case)`, jobTimes)
  // Again, with the versions' rule sets already prepared in the server.
  await replay(cookie, draft.id, `impact of draft ${draft.id} against published version ${published.id}, second run`, jobTimes)
} finally {
  await sequelize.close()
}
