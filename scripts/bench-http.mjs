// HTTP and browser benchmarks against a running Rimecase (RIMECASE_BENCH_BASE_URL), loopback only,
// bounded in time and count. Prints figures; asserts nothing (targets are read by people).
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

const cookie = await signIn('tech@rimecase.demo')
await rankVersusTrivial(cookie)
const caseId = await addReadingLatency(cookie, 0)
await addReadingLatency(cookie, 500)
await casePageInBrowser(cookie, caseId)
