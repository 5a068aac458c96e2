/**
 * Accuracy report for shared/utils/properties: per fluid, the largest saturation-temperature error (K)
 * against the reference points used in the unit tests (reduced temperature 0.5–0.95 only) and the largest
 * gas-density error (%). Prints a Markdown table and, if README.md has the markers
 * <!-- accuracy:start --> / <!-- accuracy:end -->, rewrites the block between them.
 * Run: npm run accuracy
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { DESIGNATIONS, findRefrigerant, gasDensity, saturationPressure, saturationTemperature } from '../shared/utils/properties/index'
import { GAS_DENSITY, INDEPENDENT, SATURATION } from '../tests/unit/shared/properties/reference-points'

const rows: string[] = [
  '| Fluid | Sat. points (0.5 ≤ T/Tc ≤ 0.95) | Max \\|ΔT\\| K | Density points | Max \\|Δρ\\| % | Reference |',
  '|---|---|---|---|---|---|',
]
for (const d of DESIGNATIONS) {
  const info = findRefrigerant(d)!
  const TcK = info.criticalTemperatureC + 273.15
  const pts = SATURATION[d].sat.filter((p) => (p.c + 273.15) / TcK >= 0.5 && (p.c + 273.15) / TcK <= 0.95)
  let dT = 0
  for (const p of pts) {
    dT = Math.max(dT, Math.abs(saturationTemperature(d, p.kpa).bubbleC - p.c))
    dT = Math.max(dT, Math.abs(saturationTemperature(d, p.dewKpa ?? p.kpa).dewC - p.c))
  }
  const dens = GAS_DENSITY[d] ?? []
  let dRho = 0
  for (const p of dens) dRho = Math.max(dRho, Math.abs(gasDensity(d, p.c, p.kpa) / p.rho - 1) * 100)
  rows.push(`| ${d} | ${pts.length} | ${pts.length ? dT.toFixed(3) : '–'} | ${dens.length || '–'} | ${dens.length ? dRho.toFixed(3) : '–'} | ${SATURATION[d].source} |`)
}
rows.push(
  '',
  'Cross-checks against sources that do not share the equation of state (saturation pressure; temperature error at the same pressure):',
  '',
  '| Fluid | Independent source | Points | Max \\|Δp\\| % | Max \\|ΔT\\| K |',
  '|---|---|---|---|---|',
)
for (const check of INDEPENDENT) {
  let dp = 0, dT = 0
  for (const p of check.sat) {
    dp = Math.max(dp, Math.abs(saturationPressure(check.d, p.c).bubbleKpa / p.kpa - 1) * 100)
    dT = Math.max(dT, Math.abs(saturationTemperature(check.d, p.kpa).bubbleC - p.c))
  }
  rows.push(`| ${check.d} | ${check.source} | ${check.sat.length} | ${dp.toFixed(2)} | ${dT.toFixed(2)} |`)
}
const table = rows.join('\n')
console.log(table)

const readme = new URL('../README.md', import.meta.url)
if (existsSync(readme)) {
  const text = readFileSync(readme, 'utf8')
  const re = /(<!-- accuracy:start -->)[\s\S]*?(<!-- accuracy:end -->)/
  if (re.test(text)) {
    writeFileSync(readme, text.replace(re, `$1\n${table}\n$2`))
    console.log('\nREADME.md accuracy block updated.')
  }
}
