/**
 * Micro-benchmark for shared/utils/properties (single core): saturation calls per second (T → p and
 * p → T), standing-pressure solves per second (charge → pressure and pressure → charge), and the
 * minified + gzipped size the module adds to a browser bundle (esbuild, as vite uses).
 * Run: npx tsx scripts/bench-properties.ts
 */
import { gzipSync } from 'node:zlib'
import { build } from 'esbuild'
import { DESIGNATIONS, chargeFromStandingPressure, findRefrigerant, saturationPressure, saturationTemperature, standingPressureFromCharge } from '../shared/utils/properties/index'

function rate(label: string, n: number, f: (i: number) => number): number {
  for (let i = 0; i < Math.min(n, 20000); i++) f(i) // warm up the JIT and the lazy tables
  const t0 = performance.now()
  let sink = 0
  for (let i = 0; i < n; i++) sink += f(i)
  const s = (performance.now() - t0) / 1000
  const r = n / s
  console.log(`${label.padEnd(44)} ${Math.round(r).toLocaleString('en-US').padStart(12)} /s${Number.isFinite(sink) ? '' : ' (!)'}`)
  return r
}

const fluids = DESIGNATIONS.map((d) => ({ d, info: findRefrigerant(d)! }))
const temps = fluids.map(({ info }) => Array.from({ length: 64 }, (_, k) => info.validRange.minC + (info.validRange.maxC - info.validRange.minC) * (0.05 + 0.9 * (k / 63))))
const press = fluids.map(({ d }, j) => temps[j]!.map((c) => saturationPressure(d, c).dewKpa))

const N = 400_000
const satTp = rate('saturationPressure (T → p)', N, (i) => { const j = i % fluids.length; return saturationPressure(fluids[j]!.d, temps[j]![i & 63]!).bubbleKpa })
const satPT = rate('saturationTemperature (p → T)', N, (i) => { const j = i % fluids.length; return saturationTemperature(fluids[j]!.d, press[j]![i & 63]!).dewC })
const lowStage = ['R170', 'R1150', 'R23', 'R14', 'R508B', 'R744'] as const
const st1 = rate('standingPressureFromCharge', 100_000, (i) => standingPressureFromCharge({ designation: lowStage[i % 6]!, ambientC: 15 + (i % 17), volumeL: 10, chargeG: 50 + (i % 250) }).pressureKpa)
const st2 = rate('chargeFromStandingPressure (EOS Newton)', 100_000, (i) => chargeFromStandingPressure({ designation: lowStage[i % 6]!, ambientC: 15 + (i % 17), volumeL: 10, pressureKpa: 300 + (i % 1200) }).chargeG)

const out = await build({
  entryPoints: [new URL('../shared/utils/properties/index.ts', import.meta.url).pathname],
  bundle: true, minify: true, format: 'esm', platform: 'browser', write: false, target: 'es2020',
})
const js = out.outputFiles[0]!.contents
const gz = gzipSync(js, { level: 9 }).length
console.log(`bundle: ${js.length.toLocaleString('en-US')} B minified, ${gz.toLocaleString('en-US')} B min+gzip`)
const ok = Math.min(satTp, satPT) >= 200_000 && Math.min(st1, st2) >= 20_000
console.log(ok ? 'targets met (≥ 200k saturation/s, ≥ 20k standing/s)' : 'TARGETS MISSED (≥ 200k saturation/s, ≥ 20k standing/s)')
