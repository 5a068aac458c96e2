// HTTP and browser benchmarks against a running Rimecase (RIMECASE_BENCH_BASE_URL), loopback only,
// bounded in time and count. Prints figures; asserts nothing (targets are read by people).
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs'
import { gzipSync } from 'node:zlib'
import autocannon from 'autocannon'
import { chromium } from '@playwright/test'

const BASE = process.env.RIMECASE_BENCH_BASE_URL ?? 'http://127.0.0.1:3000'
const SECONDS = Number(process.env.RIMECASE_BENCH_SECONDS ?? 8)

async function signIn(email) {
  const res = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'rimecase-demo' }) })
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`)
  return res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session=')).split(';')[0]
}

function cannon(opts) {
  return new Promise((resolve, reject) => {
    autocannon({ connections: 20, duration: SECONDS, ...opts }, (error, result) => (error ? reject(error) : resolve(result)))
  })
}

const RANK_BODY = {
  unit: {
    kind: 'cascade',
    stages: [{ stage: 'high', refrigerant: 'R404A', chargeG: 520 }, { stage: 'low', refrigerant: 'R170', chargeG: 250, volumeL: 9.5, referenceStandingPressureKpa: 1790, referenceAmbientC: 21 }],
    design: { cabinetC: -80, cascadeHxC: -30 },
  },
  symptoms: ['not-cooling'],
  readings: [
    { quantity: 'suctionPressure', stage: 'low', value: 15, unit: 'psig' },
    { quantity: 'cabinetTemperature', value: -45, unit: 'C' },
    { quantity: 'cascadeHxTemperature', value: -31, unit: 'C' },
    { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
    { quantity: 'compressorRunning', stage: 'high', value: true, unit: 'bool' },
  ],
  testResults: [],
}

const pct = (sorted, p) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]

async function rankVersusTrivial(cookie) {
  const headers = { cookie, 'content-type': 'application/json' }
  const trivial = await cannon({ url: `${BASE}/api/auth/me`, headers })
  const rank = await cannon({ url: `${BASE}/api/diagnosis/rank`, method: 'POST', headers, body: JSON.stringify(RANK_BODY) })
  // Every request a different cabinet temperature: nothing can come from the ranking memo.
  let n = 0
  const varied = await cannon({
    url: `${BASE}/api/diagnosis/rank`,
    requests: [{
      method: 'POST', headers,
      setupRequest: (req) => {
        n++
        const body = { ...RANK_BODY, readings: RANK_BODY.readings.map((r) => (r.quantity === 'cabinetTemperature' ? { ...r, value: -45 + (n % 4000) / 100 } : r)) }
        return { ...req, body: JSON.stringify(body) }
      },
    }],
  })
  const row = (name, r) => `  ${name.padEnd(44)} ${String(Math.round(r.requests.average)).padStart(6)} req/s   p50 ${r.latency.p50} ms   p97.5 ${r.latency.p97_5} ms   non-2xx ${r.non2xx}`
  console.log(`autocannon, 20 connections, ${SECONDS} s each (loopback)`)
  console.log(row('GET /api/auth/me (trivial, signed in)', trivial))
  console.log(row('POST /api/diagnosis/rank (same body)', rank))
  console.log(row('POST /api/diagnosis/rank (every body new)', varied))
  console.log(`  rank / trivial throughput: ${(rank.requests.average / trivial.requests.average).toFixed(2)} same body, ${(varied.requests.average / trivial.requests.average).toFixed(2)} every body new (target >= 0.50)`)
}

async function addReadingLatency(cookie, thinkMs) {
  const headers = { cookie, 'content-type': 'application/json' }
  const units = await (await fetch(`${BASE}/api/units`, { headers })).json()
  const unit = units.find((u) => u.kind === 'cascade')
  const cases = []
  for (let i = 0; i < 20; i++) {
    const res = await fetch(`${BASE}/api/cases`, { method: 'POST', headers, body: JSON.stringify({ unitId: unit.id, complaint: `Bench technician ${i}: not cooling`, symptoms: ['not-cooling'] }) })
    cases.push((await res.json()).id)
  }
  const PER_TECH = 25
  const latencies = []
  let failures = 0
  const started = performance.now()
  await Promise.all(cases.map(async (id, t) => {
    for (let k = 0; k < PER_TECH; k++) {
      if (thinkMs) await new Promise((r) => setTimeout(r, thinkMs * (0.5 + Math.random())))
      const body = JSON.stringify({ readings: [{ quantity: 'cabinetTemperature', value: -40 - ((k + t) % 30), unit: 'C' }] })
      const t0 = performance.now()
      const res = await fetch(`${BASE}/api/cases/${id}/readings`, { method: 'POST', headers, body })
      await res.arrayBuffer()
      latencies.push(performance.now() - t0)
      if (res.status !== 200) failures++
    }
  }))
  const seconds = (performance.now() - started) / 1000
  latencies.sort((a, b) => a - b)
  console.log(`add reading and re-rank: 20 technicians x ${PER_TECH} readings, each on its own open case, ${thinkMs ? `about ${thinkMs} ms between a technician's readings` : 'no pause between readings (saturation)'}`)
  console.log(`  p50 ${pct(latencies, 50).toFixed(1)} ms   p95 ${pct(latencies, 95).toFixed(1)} ms (target <= 100 ms)   ${(latencies.length / seconds).toFixed(0)} req/s   failures ${failures}`)
  return cases[0]
}

async function casePageInBrowser(cookie, caseId) {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'] })
  try {
    const [name, value] = cookie.split('=')
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
    await context.addCookies([{ name, value, url: BASE }])
    const page = await context.newPage()
    const scripts = new Map()
    page.on('response', async (res) => {
      if (res.request().resourceType() === 'script') {
        const body = await res.body().catch(() => Buffer.alloc(0))
        scripts.set(res.url(), { raw: body.length, gzip: gzipSync(body, { level: 9 }).length, encoding: res.headers()['content-encoding'] ?? 'identity' })
      }
    })
    const times = []
    for (let i = 0; i < 5; i++) {
      await page.goto('about:blank')
      const t0 = Date.now()
      await page.goto(`${BASE}/cases/${caseId}`)
      // Interactive: the phone action bar answers a tap by opening the reading form (needs hydration).
      await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
      await page.getByRole('form', { name: 'Add a reading' }).waitFor()
      times.push(Date.now() - t0)
    }
    const raw = [...scripts.values()].reduce((a, s) => a + s.raw, 0)
    const gz = [...scripts.values()].reduce((a, s) => a + s.gzip, 0)
    times.sort((a, b) => a - b)
    console.log(`case page in Chromium (390x844, loopback)`)
    console.log(`  JavaScript: ${scripts.size} files, ${(raw / 1024).toFixed(0)} KB uncompressed, ${(gz / 1024).toFixed(0)} KB gzipped (target <= 300 KB); served with ${[...new Set([...scripts.values()].map((s) => s.encoding))].join(', ')}`)
    console.log(`  time until interactive (navigation to a working "Add reading" tap): median ${times[2]} ms, best ${times[0]} ms, worst ${times[4]} ms`)
  } finally {
    await browser.close()
  }
}

/** Peak resident memory (VmHWM) of each process of the app server on this machine, MB. */
function serverPeaks() {
  const peaks = []
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8')
      const env = readFileSync(`/proc/${pid}/environ`, 'utf8')
      if (!cmd.includes('.output/server/index.mjs') || !env.includes(`PORT=${new URL(BASE).port}\0`)) continue
      const hwm = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))
      if (hwm) peaks.push(Number(hwm[1]) / 1024)
    } catch {
      // A process that ended or is not ours to read.
    }
  }
  return peaks
}

/**
 * The 50 MB logger file of the in-process benchmark, sent over HTTP to a case, mapped and analysed by
 * the server's background job: upload time, time to a finished analysis, and the server's peak memory.
 */
async function loggerUpload(cookie) {
  const file = new URL('../.bench/logger-1m-rows-v2.csv', import.meta.url)
  if (!existsSync(file)) return console.log('logger upload: skipped (run scripts/bench-logger.ts first to make the file)')
  const headers = { cookie, 'content-type': 'application/json' }
  const units = await (await fetch(`${BASE}/api/units`, { headers })).json()
  const opened = await (await fetch(`${BASE}/api/cases`, { method: 'POST', headers, body: JSON.stringify({ unitId: units[0].id, complaint: 'Logger benchmark', symptoms: [] }) })).json()
  const bytes = readFileSync(file)
  const t0 = Date.now()
  const up = await fetch(`${BASE}/api/cases/${opened.id}/logger-files?name=bench.csv`, { method: 'POST', headers: { cookie, 'content-type': 'text/csv' }, body: bytes })
  const uploaded = await up.json()
  if (up.status !== 201) throw new Error(`logger upload failed: ${up.status} ${JSON.stringify(uploaded)}`)
  const t1 = Date.now()
  const mapping = {
    time: { column: 'Zeit' }, setpointC: -80,
    columns: [
      { column: 'Innenraum (°C)', quantity: 'cabinetTemperature', unit: 'C' }, { column: 'Kaskade (°C)', quantity: 'cascadeHxTemperature', unit: 'C' },
      { column: 'Raum (°C)', quantity: 'ambientTemperature', unit: 'C' }, { column: 'Verdichter', quantity: 'compressorRunning', stage: 'low', unit: 'bool' },
      { column: 'Strom (A)', quantity: 'compressorCurrent', stage: 'low', unit: 'A' },
    ],
  }
  const queued = await (await fetch(`${BASE}/api/logger-files/${uploaded.id}/process`, { method: 'POST', headers, body: JSON.stringify({ mapping }) })).json()
  let job
  for (let i = 0; i < 1200; i++) {
    // A poll that meets a connection closed by the server is simply repeated.
    job = await fetch(`${BASE}/api/jobs/${queued.jobId}`, { headers }).then((r) => r.json()).catch((error) => (console.log(`  (poll: ${error.cause?.code ?? error.message})`), job))
    if (job.state === 'done' || job.state === 'failed') break
    await new Promise((r) => setTimeout(r, 250))
  }
  const t2 = Date.now()
  const peaks = serverPeaks()
  console.log(`logger file over HTTP (${(statSync(file).size / 1048576).toFixed(1)} MB, job ${job?.state}, ${job?.result?.rows?.toLocaleString('en-US')} rows)`)
  console.log(`  upload with first look ${((t1 - t0) / 1000).toFixed(2)} s; mapping check, queue and analysis ${((t2 - t1) / 1000).toFixed(2)} s`)
  console.log(`  server processes' peak memory (VmHWM): ${peaks.map((p) => `${p.toFixed(0)} MB`).join(', ') || 'not readable'} (target 300 MB for the process doing the work)`)
}

const cookie = await signIn('tech@rimecase.demo')
await loggerUpload(cookie)
// RIMECASE_BENCH_ONLY=logger stops after the logger upload.
if (process.env.RIMECASE_BENCH_ONLY === 'logger') process.exit(0)
await rankVersusTrivial(cookie)
const caseId = await addReadingLatency(cookie, 0)
await addReadingLatency(cookie, 500)
await casePageInBrowser(cookie, caseId)
