// Load figures against a running Rimecase (RIMECASE_BENCH_BASE_URL), loopback only, each part bounded
// in time: a mixed technician workload, a soak with the server's memory over time, and the case
// list at 100 rows a page. Prints figures; asserts nothing (targets are read by people).
//   RIMECASE_BENCH_LOAD_SECONDS   the mixed workload's length (default 60)
//   RIMECASE_BENCH_SOAK_SECONDS   the soak's length (default 300; e.g. 60 for a quick look)
//   RIMECASE_BENCH_LIST_SECONDS   the case list's length (default 20)
import { readFileSync, readdirSync } from 'node:fs'
import autocannon from 'autocannon'

const BASE = process.env.RIMECASE_BENCH_BASE_URL ?? 'http://127.0.0.1:3000'
const LOAD_SECONDS = Number(process.env.RIMECASE_BENCH_LOAD_SECONDS ?? 60)
const SOAK_SECONDS = Number(process.env.RIMECASE_BENCH_SOAK_SECONDS ?? 300)
const LIST_SECONDS = Number(process.env.RIMECASE_BENCH_LIST_SECONDS ?? 20)
const TECH = { email: 'tech@rimecase.demo', password: 'rimecase-demo' }
const POOL = 200

async function signIn() {
  const res = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(TECH) })
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`)
  return res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session=')).split(';')[0]
}

/** Open cases on a cascade unit for the workload to work on, so the list has well over 100 rows. */
async function openCases(cookie, count) {
  const headers = { cookie, 'content-type': 'application/json' }
  const units = await (await fetch(`${BASE}/api/units`, { headers })).json()
  const unit = units.find((u) => u.kind === 'cascade') ?? units[0]
  const ids = []
  for (let i = 0; i < count; i++) {
    const res = await fetch(`${BASE}/api/cases`, { method: 'POST', headers, body: JSON.stringify({ unitId: unit.id, complaint: `Load bench ${i}: cabinet warm`, symptoms: ['not-cooling'] }) })
    if (res.status !== 201) throw new Error(`could not open a case: ${res.status}`)
    ids.push((await res.json()).id)
  }
  return ids
}

/** Resident memory (VmRSS) of every process of the app server listening on BASE's port, MB. */
function serverRss() {
  let total = 0
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8')
      const env = readFileSync(`/proc/${pid}/environ`, 'utf8')
      if (!cmd.includes('.output/server/index.mjs') || !env.includes(`PORT=${new URL(BASE).port}\0`)) continue
      const rss = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))
      if (rss) total += Number(rss[1]) / 1024
    } catch {
      // A process that ended or is not ours to read.
    }
  }
  return total
}

const pct = (sorted, p) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN)

/**
 * One technician per connection, going round: sign in, open a case, add a reading (the case is
 * ranked again), record a test result, list the cases. Each round takes the next case of the pool.
 */
function mixedWorkload(cases, { connections, seconds, onTick }) {
  let next = 0
  const statuses = {}
  const latencies = { 'sign in': [], 'open a case': [], 'add a reading and re-rank': [], 'record a test': [], 'list cases': [] }
  const json = { 'content-type': 'application/json' }
  const step = (name, build) => ({
    setupRequest: (req, context) => {
      context.step = name
      context.sent = performance.now()
      return build(req, context)
    },
    onResponse: (status, _body, context, headers) => {
      latencies[name].push(performance.now() - context.sent)
      statuses[`${name} ${status}`] = (statuses[`${name} ${status}`] ?? 0) + 1
      if (name === 'sign in') {
        const raw = headers['set-cookie'] ?? headers['Set-Cookie']
        const cookie = (Array.isArray(raw) ? raw : [raw]).find((c) => c?.startsWith('nuxt-session='))
        if (cookie) context.cookie = cookie.split(';')[0]
      }
    },
  })
  const requests = [
    step('sign in', (req, context) => {
      context.caseId = cases[next++ % cases.length]
      context.round = (context.round ?? 0) + 1
      return { ...req, method: 'POST', path: '/api/auth/login', headers: json, body: JSON.stringify(TECH) }
    }),
    step('open a case', (req, context) => ({ ...req, method: 'GET', path: `/api/cases/${context.caseId}`, headers: { cookie: context.cookie } })),
    step('add a reading and re-rank', (req, context) => ({
      ...req, method: 'POST', path: `/api/cases/${context.caseId}/readings`, headers: { ...json, cookie: context.cookie },
      body: JSON.stringify({ readings: [{ quantity: 'cabinetTemperature', value: -40 - (context.round % 30), unit: 'C' }] }),
    })),
    step('record a test', (req, context) => ({
      ...req, method: 'POST', path: `/api/cases/${context.caseId}/test-results`, headers: { ...json, cookie: context.cookie },
      body: JSON.stringify({ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }),
    })),
    step('list cases', (req, context) => ({ ...req, method: 'GET', path: '/api/cases?pageSize=20', headers: { cookie: context.cookie } })),
  ]
  return new Promise((resolve, reject) => {
    const instance = autocannon({ url: BASE, connections, duration: seconds, requests, timeout: 30 }, (error, result) => {
      clearInterval(timer)
      if (error) reject(error)
      else resolve({ result, statuses, latencies })
    })
    const timer = onTick ? setInterval(onTick, 15_000) : null
    instance.on('error', () => {})
  })
}

function printWorkload(title, { result, statuses, latencies }, seconds) {
  const all = Object.values(latencies).flat().sort((a, b) => a - b)
  const failed = Object.entries(statuses).filter(([k]) => !/ 2\d\d$/.test(k))
  console.log(title)
  console.log(`  ${result.requests.total} requests in ${seconds} s: ${(result.requests.total / seconds).toFixed(0)} req/s, ${(latencies['list cases'].length / seconds).toFixed(1)} full rounds/s`)
  console.log(`  all requests   p50 ${pct(all, 50).toFixed(0)} ms   p95 ${pct(all, 95).toFixed(0)} ms   p99 ${pct(all, 99).toFixed(0)} ms`)
  for (const [name, list] of Object.entries(latencies)) {
    const sorted = list.sort((a, b) => a - b)
    console.log(`  ${name.padEnd(26)} ${String(sorted.length).padStart(6)}   p50 ${pct(sorted, 50).toFixed(0)} ms   p95 ${pct(sorted, 95).toFixed(0)} ms   p99 ${pct(sorted, 99).toFixed(0)} ms`)
  }
  console.log(`  errors: ${result.errors} connection errors, ${result.timeouts} timeouts, ${failed.length ? failed.map(([k, n]) => `${k}×${n}`).join(', ') : 'no non-2xx answers'}`)
}

async function caseList(cookie) {
  const result = await new Promise((resolve, reject) => {
    autocannon({ url: `${BASE}/api/cases?pageSize=100`, connections: 20, duration: LIST_SECONDS, headers: { cookie } }, (error, r) => (error ? reject(error) : resolve(r)))
  })
  const page = await (await fetch(`${BASE}/api/cases?pageSize=100`, { headers: { cookie } })).json()
  console.log(`case list, 100 rows a page (GET /api/cases?pageSize=100, ${page.items.length} rows of ${page.total}), 20 connections, ${LIST_SECONDS} s`)
  console.log(`  ${Math.round(result.requests.average)} req/s (target >= 200)   p50 ${result.latency.p50} ms   p99 ${result.latency.p99} ms   ${(JSON.stringify(page).length / 1024).toFixed(0)} KB a page   non-2xx ${result.non2xx}, errors ${result.errors}`)
}

const cookie = await signIn()
const cases = await openCases(cookie, POOL)
console.log(`load figures against ${BASE} (${POOL} open cases made for the workload)`)
console.log(`  machine load before: ${readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ')} (1, 5, 15 min)`)

await caseList(cookie)

const load = await mixedWorkload(cases, { connections: 50, seconds: LOAD_SECONDS })
printWorkload(`mixed technician workload, 50 connections, ${LOAD_SECONDS} s`, load, LOAD_SECONDS)

// The soak: the same workload at 20 connections, the server's memory read every 15 s.
const samples = [{ t: 0, mb: serverRss() }]
const soakStart = Date.now()
const soak = await mixedWorkload(cases, {
  connections: 20, seconds: SOAK_SECONDS,
  onTick: () => samples.push({ t: Math.round((Date.now() - soakStart) / 1000), mb: serverRss() }),
})
samples.push({ t: Math.round((Date.now() - soakStart) / 1000), mb: serverRss() })
printWorkload(`soak: the same workload, 20 connections, ${SOAK_SECONDS} s`, soak, SOAK_SECONDS)
console.log(`  server memory (VmRSS of all its processes): ${samples.map((s) => `${s.t}s ${s.mb.toFixed(0)}`).join(', ')} MB`)
// Levelling off: growth over the second half against growth over the first.
const mid = samples.filter((s) => s.t >= SOAK_SECONDS / 2)
const firstHalf = samples.filter((s) => s.t <= SOAK_SECONDS / 2)
const growthA = firstHalf.at(-1).mb - firstHalf[0].mb
const growthB = mid.at(-1).mb - mid[0].mb
const perMin = (growthB / Math.max(1, mid.at(-1).t - mid[0].t)) * 60
console.log(`  growth: first half ${growthA.toFixed(0)} MB, second half ${growthB.toFixed(0)} MB (${perMin.toFixed(1)} MB/min): ${Math.abs(growthB) <= Math.max(10, 0.25 * Math.abs(growthA)) ? 'levels off' : 'still growing'}`)
console.log(`  machine load after: ${readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ')} (1, 5, 15 min)`)
