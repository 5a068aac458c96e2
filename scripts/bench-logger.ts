/**
 * Data-logger CSV benchmark (run: npx tsx --tsconfig tsconfig.scripts.json scripts/bench-logger.ts).
 *
 * Generates (once, under .bench/) a 50 MB logger file of one million rows in the awkward format many
 * loggers write (semicolons, decimal commas), then processes it streaming in a fresh Node process, the
 * way the server's background job will, and prints the time, the throughput and the peak memory
 * (resident set of that process, from the kernel's own high-water mark). Target: 300 MB peak.
 * The series is invented: a pull-down with a stall, door openings and daily ambient swings.
 */
import { spawnSync } from 'node:child_process'
import { copyFileSync, createReadStream, createWriteStream, existsSync, mkdirSync, statSync } from 'node:fs'
import { Readable } from 'node:stream'
import { join } from 'node:path'
import { performance } from 'node:perf_hooks'
import { fileURLToPath } from 'node:url'
import { processLoggerCsv } from '#server/domain/logger/logger-processor'
import { openStoredStream } from '#server/utils/upload-storage'

const ROOT = fileURLToPath(new URL('..', import.meta.url))
const FILE = join(ROOT, '.bench', 'logger-1m-rows-v2.csv')
const ROWS = 1_000_000
const TARGET_MB = 300

async function generate(): Promise<void> {
  mkdirSync(join(ROOT, '.bench'), { recursive: true })
  const out = createWriteStream(FILE)
  const start = Date.UTC(2025, 2, 1, 8)
  const pad = (n: number) => String(n).padStart(2, '0')
  const comma = (v: number, d: number) => v.toFixed(d).replace('.', ',')
  out.write('Logger: invented model LX-9, serial 0000-BENCH\nSampling: 1 s\nZeit;Innenraum (°C);Kaskade (°C);Raum (°C);Verdichter;Strom (A);Tür\n')
  let cabinet = 21
  let lines: string[] = []
  for (let i = 0; i < ROWS; i++) {
    const t = new Date(start + i * 1000)
    const hours = i / 3600
    const stalled = hours > 2 && hours < 4 && cabinet < -44
    const door = i % 86_400 > 36_000 && i % 86_400 < 36_120
    if (door) cabinet += 0.08
    else if (!stalled) cabinet = Math.max(-80 + 0.3 * Math.sin(i / 600), cabinet - 0.008)
    const ambient = 21 + 2 * Math.sin((2 * Math.PI * i) / 86_400)
    const stamp = `${t.getUTCFullYear()}-${pad(t.getUTCMonth() + 1)}-${pad(t.getUTCDate())} ${pad(t.getUTCHours())}:${pad(t.getUTCMinutes())}:${pad(t.getUTCSeconds())}`
    lines.push(`${stamp};${comma(cabinet, 3)};${comma(-35 + Math.sin(i / 900), 3)};${comma(ambient, 3)};1;${comma(3.4 + 0.05 * Math.sin(i / 60), 3)};${door ? 1 : 0}`)
    if (lines.length === 10_000) {
      if (!out.write(`${lines.join('\n')}\n`)) await new Promise((r) => out.once('drain', r))
      lines = []
    }
  }
  out.write(lines.length ? `${lines.join('\n')}\n` : '')
  await new Promise<void>((resolve, reject) => out.end((e?: Error | null) => (e ? reject(e) : resolve())))
}

/**
 * The source of the bytes: the file streamed from disk, or (`stored`) the file put in an upload store
 * on disk (the fs driver the server mounts) and opened from it a chunk at a time, with a pause every few
 * chunks, as the server's background job reads an upload back.
 */
async function source(stored: boolean): Promise<Readable> {
  if (!stored) return createReadStream(FILE)
  const store = join(ROOT, '.bench', 'upload-store')
  const key = 'org-0/logger-bench'
  mkdirSync(join(store, 'org-0'), { recursive: true })
  if (!existsSync(join(store, key)) || statSync(join(store, key)).size !== statSync(FILE).size) copyFileSync(FILE, join(store, key))
  const opened = await openStoredStream({ uploadDriver: 'fs', uploadDir: store }, key)
  if (!opened) throw new Error('the benchmark file is missing from its upload store')
  return Readable.from((async function* () {
    let n = 0
    for await (const chunk of opened.stream) {
      yield chunk as Buffer
      if (n++ % 8 === 7) await new Promise((resolve) => setImmediate(resolve))
    }
  })())
}

async function measure(stored: boolean): Promise<void> {
  const baseline = process.memoryUsage().rss
  const size = statSync(FILE).size
  let progressCalls = 0
  const t0 = performance.now()
  const result = await processLoggerCsv(
    await source(stored),
    {
      time: { column: 'Zeit' },
      columns: [
        { column: 'Innenraum (°C)', quantity: 'cabinetTemperature', unit: 'C' },
        { column: 'Kaskade (°C)', quantity: 'cascadeHxTemperature', unit: 'C' },
        { column: 'Raum (°C)', quantity: 'ambientTemperature', unit: 'C' },
        { column: 'Verdichter', quantity: 'compressorRunning', stage: 'low', unit: 'bool' },
        { column: 'Strom (A)', quantity: 'compressorCurrent', stage: 'low', unit: 'A' },
        { column: 'Tür', quantity: 'other', unit: 'none', label: 'Door contact' },
      ],
      setpointC: -80,
    },
    { totalBytes: size, onProgress: () => progressCalls++ },
  )
  const seconds = (performance.now() - t0) / 1000
  const peakMb = process.resourceUsage().maxRSS / 1024
  console.log(
    JSON.stringify({
      seconds,
      rows: result.rows.valid,
      status: result.status,
      errors: result.rows.withErrors,
      stalls: result.stalls.length,
      points: result.series[0]?.points.length ?? 0,
      progressCalls,
      baselineMb: baseline / 1048576,
      peakMb,
      sizeMb: size / 1048576,
    }),
  )
}

function report(label: string, r: { seconds: number; rows: number; status: string; errors: number; stalls: number; points: number; progressCalls: number; baselineMb: number; peakMb: number; sizeMb: number }) {
  const mbPerS = r.sizeMb / r.seconds
  console.log(`logger CSV ${r.sizeMb.toFixed(1)} MB, ${r.rows.toLocaleString('en-US')} rows, ${label} (status ${r.status}, ${r.errors} row errors, ${r.stalls} stall found, ${r.points} chart points, ${r.progressCalls} progress reports)`)
  console.log(`  analysis                ${r.seconds.toFixed(2)} s   ${Math.round(r.rows / r.seconds).toLocaleString('en-US')} rows/s   ${mbPerS.toFixed(1)} MB/s`)
  console.log(`  peak memory (max RSS)   ${r.peakMb.toFixed(0)} MB   (Node at start ${r.baselineMb.toFixed(0)} MB)`)
  console.log(r.peakMb <= TARGET_MB ? `  target met (peak ≤ ${TARGET_MB} MB)` : `  TARGET MISSED (peak ≤ ${TARGET_MB} MB)`)
}

if (process.argv.includes('--measure')) {
  await measure(process.argv.includes('--stored'))
} else {
  if (!existsSync(FILE) || statSync(FILE).size < 50_000_000) {
    const t = performance.now()
    await generate()
    console.log(`generated ${FILE} (${(statSync(FILE).size / 1048576).toFixed(1)} MB) in ${((performance.now() - t) / 1000).toFixed(1)} s`)
  }
  // A fresh process per run, so the peak memory is the processing's own and not the generator's.
  for (const [label, extra] of [['streamed from disk', []], ['streamed from the upload store, as the background job reads an upload', ['--stored']]] as const) {
    const child = spawnSync(process.execPath, [...process.execArgv, fileURLToPath(import.meta.url), '--measure', ...extra], { cwd: ROOT, encoding: 'utf8' })
    if (child.status !== 0) {
      console.error(child.stderr)
      process.exit(1)
    }
    report(label, JSON.parse(child.stdout.trim().split('\n').at(-1)!))
  }
}
