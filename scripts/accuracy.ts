/**
 * Accuracy report (run: npm run accuracy).
 *
 * 1. Refrigerant properties: per fluid, the largest saturation-temperature error (K) against the
 *    reference points used in the unit tests (reduced temperature 0.5–0.95 only) and the largest
 *    gas-density error (%). Rewrites the block between <!-- accuracy:start --> and <!-- accuracy:end -->.
 * 2. Diagnosis: top-1 and top-2 agreement of the ranking with the cause each scenario of the suite
 *    was built from, for the tuning part and the held-out part, with the starting odds of an
 *    organisation without history and with the demo organisation's seeded history (computed in process
 *    from the demo generator). Rewrites the block between <!-- diagnosis-accuracy:start --> and
 *    <!-- diagnosis-accuracy:end -->.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { DESIGNATIONS, findRefrigerant, gasDensity, saturationPressure, saturationTemperature } from '../shared/utils/properties/index'
import { GAS_DENSITY, INDEPENDENT, SATURATION } from '../tests/unit/shared/properties/reference-points'
import { loadKnowledgeBaseFromDirectory } from '../server/domain/diagnosis/content-loader'
import type { KnowledgeBase } from '../server/domain/diagnosis/knowledge-base'
import { demoHistoryCounts } from '../server/db/seeders/demo-cases'
import { HELD_OUT_SCENARIOS, TUNING_SCENARIOS, hypothesisLabel, scoreSuite, type SuiteScore } from '../server/domain/diagnosis/scenarios/suite'

function propertyTable(): string {
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
    let dp = 0
    let dT = 0
    for (const p of check.sat) {
      dp = Math.max(dp, Math.abs(saturationPressure(check.d, p.c).bubbleKpa / p.kpa - 1) * 100)
      dT = Math.max(dT, Math.abs(saturationTemperature(check.d, p.kpa).bubbleC - p.c))
    }
    rows.push(`| ${check.d} | ${check.source} | ${check.sat.length} | ${dp.toFixed(2)} | ${dT.toFixed(2)} |`)
  }
  return rows.join('\n')
}

const percent = (n: number, total: number) => `${((100 * n) / total).toFixed(1)} %`
const cell = (s: SuiteScore, n: 1 | 2) => {
  const hits = n === 1 ? s.top1 : s.top2
  return `${hits}/${s.total} (${percent(hits, s.total)})`
}

async function diagnosisTable(): Promise<{ table: string; misses: string[] }> {
  const kb: KnowledgeBase = { ...loadKnowledgeBaseFromDirectory(join(process.cwd(), 'content-src')), version: { id: 'content-src', label: 'seed', status: 'draft' } }
  const history = demoHistoryCounts()
  const historyOf = (equipmentClass: string) => history.get(equipmentClass) ?? []
  const confirmed = [...history.values()].flat()
  const definitive = confirmed.filter((c) => c.definitive).reduce((a, c) => a + c.count, 0)
  const total = confirmed.reduce((a, c) => a + c.count, 0)
  const rows = [
    '| Scenarios | Starting odds | Top-1 | Top-2 |',
    '|---|---|---|---|',
  ]
  const misses: string[] = []
  for (const [part, scenarios] of [['tuning', TUNING_SCENARIOS], ['held-out', HELD_OUT_SCENARIOS]] as const) {
    for (const [regime, byClass] of [['no history', undefined], [`demo history (${definitive} of ${total} confirmations definitive)`, historyOf]] as const) {
      const score = await scoreSuite(kb, scenarios, byClass)
      rows.push(`| ${part} (${score.total}) | ${regime} | ${cell(score, 1)} | ${cell(score, 2)} |`)
      for (const r of score.results.filter((x) => x.rank !== 1)) {
        misses.push(`${part}, ${regime}: ${r.scenario.id} ${r.scenario.title}: expected ${hypothesisLabel(r.scenario.expected)}, ranked ${r.rank || 'absent'}; first ${r.ranked[0]}`)
      }
    }
  }
  return { table: rows.join('\n'), misses }
}

function rewrite(block: string, table: string): boolean {
  const readme = new URL('../README.md', import.meta.url)
  if (!existsSync(readme)) return false
  const text = readFileSync(readme, 'utf8')
  const re = new RegExp(`(<!-- ${block}:start -->)[\\s\\S]*?(<!-- ${block}:end -->)`)
  if (!re.test(text)) return false
  writeFileSync(readme, text.replace(re, `$1\n${table}\n$2`))
  return true
}

async function main(): Promise<void> {
  const properties = propertyTable()
  console.log('Refrigerant properties against reference values\n')
  console.log(properties)
  if (rewrite('accuracy', properties)) console.log('\nREADME.md accuracy block updated.')
  const { table, misses } = await diagnosisTable()
  console.log('\nDiagnosis scenario suite: the cause each scenario was built from, ranked first (top-1) or in the first two (top-2)\n')
  console.log(table)
  console.log(misses.length ? `\nNot ranked first:\n${misses.map((m) => `  ${m}`).join('\n')}` : '\nEvery scenario ranked its cause first.')
  if (rewrite('diagnosis-accuracy', table)) console.log('\nREADME.md diagnosis accuracy block updated.')
}

main().catch((e: unknown) => {
  console.error(e)
  process.exitCode = 1
})
