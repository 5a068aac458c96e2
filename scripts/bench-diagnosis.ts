/**
 * Diagnosis ranking benchmark (run: npx tsx --tsconfig tsconfig.scripts.json scripts/bench-diagnosis.ts).
 *
 * Prints, in one run:
 *   1. rankDiagnosis latency (facts + rules + ranking + next test) with the seed base from content-src,
 *      on two fixed cases and over the scenario suite;
 *   2. the same with a generated 2,000-rule base over the real fact vocabulary;
 *   3. the rule-evaluation step of (2) against a bare json-rules-engine 7.3.1 run of the same
 *      2,000 rules on the same facts, and the ratio.
 * Loops are bounded; numbers are wall-clock on whatever this machine has spare.
 */
import { join } from 'node:path'
import { performance } from 'node:perf_hooks'
import { Engine } from 'json-rules-engine'
import { CAUSES, type Cause, type RankRequest, type Reading, type Stage } from '#shared/types/diagnosis'
import { saturationPressure } from '#shared/utils/properties'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { CUSTOM_OPERATORS, prepareKnowledgeBase, runFindings } from '#server/domain/diagnosis/engine'
import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'
import { deriveFacts } from '#server/domain/diagnosis/facts'
import { ruleDefSchema, type KnowledgeBase, type LeafCondition, type RuleDef } from '#server/domain/diagnosis/knowledge-base'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { HELD_OUT_SCENARIOS, TUNING_SCENARIOS } from '../server/domain/diagnosis/scenarios/suite'

const GENERATED_RULES = 2000

// ------------------------------------------------------------------ inputs

const p = (d: 'R290' | 'R1150', t: number) => Math.round(saturationPressure(d, t).dewKpa)

function stageReadings(stage: Stage, d: 'R290' | 'R1150', sst: number, sct: number): Reading[] {
  return [
    { quantity: 'suctionPressure', stage, value: p(d, sst), unit: 'kPa' },
    { quantity: 'dischargePressure', stage, value: p(d, sct), unit: 'kPa' },
    { quantity: 'suctionTemperature', stage, value: sst + 14, unit: 'C' },
    { quantity: 'liquidLineTemperature', stage, value: sct - 1, unit: 'C' },
    { quantity: 'dischargeTemperature', stage, value: sct + 50, unit: 'C' },
    { quantity: 'compressorCurrent', stage, value: 3.1, unit: 'A' },
    { quantity: 'compressorRunning', stage, value: true, unit: 'bool' },
  ]
}

/** A richly measured cascade case, so that most of the vocabulary is present. */
const RICH: RankRequest = {
  unit: {
    kind: 'cascade',
    stages: [
      { stage: 'high', refrigerant: 'R290', chargeG: 600, ratedCurrentA: 4 },
      { stage: 'low', refrigerant: 'R1150', chargeG: 250, volumeL: 9.5, ratedCurrentA: 3.5 },
    ],
    design: { cabinetC: -80, cascadeHxC: -35 },
  },
  symptoms: ['not-cooling', 'slow-pulldown'],
  readings: [
    ...stageReadings('high', 'R290', -42, 38),
    ...stageReadings('low', 'R1150', -100, -32),
    { quantity: 'standingPressure', stage: 'low', value: 900, unit: 'kPa' },
    { quantity: 'ambientTemperature', value: 22, unit: 'C' },
    { quantity: 'cabinetTemperature', value: -55, unit: 'C' },
    { quantity: 'setpointTemperature', value: -80, unit: 'C' },
    { quantity: 'cascadeHxTemperature', value: -34, unit: 'C' },
    { quantity: 'condenserAirInTemperature', value: 22, unit: 'C' },
    { quantity: 'condenserAirOutTemperature', value: 30, unit: 'C' },
    { quantity: 'runtime', value: 400, unit: 'min' },
  ],
}

const SPARSE: RankRequest = {
  unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }], design: { cabinetC: -20 } },
  symptoms: ['warming-over-days'],
  readings: [{ quantity: 'cabinetTemperature', value: -8, unit: 'C' }],
}

// ------------------------------------------------------------------ generated base

/** Deterministic PRNG (mulberry32) so every run benchmarks the same rules. */
function rng(seed: number): () => number {
  let a = seed
  return () => {
    a = (a + 0x6d2b79f5) | 0
    let t = Math.imul(a ^ (a >>> 15), 1 | a)
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

function generateRules(n: number): RuleDef[] {
  const rand = rng(20240601)
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)] as T
  const facts = [...FACT_SPECS.values()].filter((f) => f.type !== 'string')
  const numeric = facts.filter((f) => f.type === 'number' && f.stage)
  const ops = ['lessThan', 'greaterThan', 'between', 'withinPercent'] as const
  const causes = CAUSES.filter((c): c is Exclude<Cause, 'other' | 'no-refrigeration-fault'> => c !== 'other' && c !== 'no-refrigeration-fault')
  const p = () => Math.round((0.05 + rand() * 0.9) * 100) / 100
  const leaf = (): LeafCondition => {
    const f = pick(facts)
    if (f.type === 'boolean') return { fact: f.name, operator: 'equal', value: rand() < 0.5 }
    const op = pick(ops)
    const x = Math.round((rand() * 200 - 100) * 10) / 10
    if (op === 'between') return { fact: f.name, operator: op, value: [x, x + 5 + rand() * 40] }
    if (op === 'withinPercent') return { fact: f.name, operator: op, value: [x === 0 ? 1 : x, 5 + Math.round(rand() * 30)] }
    return { fact: f.name, operator: op, value: x }
  }
  return Array.from({ length: n }, (_, i) => {
    const leaves = Array.from({ length: 1 + Math.floor(rand() * 3) }, leaf)
    const stage = leaves.map((l) => FACT_SPECS.get(l.fact)?.stage).find(Boolean) ?? pick(['high', 'low', 'single'] as const)
    const cause = pick(causes)
    // A quarter of the findings are graded over a measured residual, the rest categorical.
    const graded = rand() < 0.25
    const measured = pick(numeric.filter((f) => f.stage === stage))
    const params = graded
      ? {
          stage,
          measure: { fact: measured.name, sigma: 1 + rand() * 3, unit: measured.unit, bands: { low: [-30, -5], normal: [-5, 5], high: [5, 30] } },
          likelihoods: { healthy: 'normal', default: { normal: 0.6, low: 0.2, high: 0.2 }, other: 'any', [cause]: pick(['low', 'high']) },
          because: 'generated',
        }
      : { stage, likelihoods: { healthy: p(), default: p(), other: p(), [cause]: p() }, because: 'generated' }
    return ruleDefSchema.parse({ name: `gen-${i}`, conditions: { all: leaves }, event: { type: 'finding', params } })
  })
}

// ------------------------------------------------------------------ timing

interface Stats {
  p50: number
  p95: number
  n: number
}

async function time(n: number, warmup: number, fn: (i: number) => Promise<unknown>): Promise<Stats> {
  for (let i = 0; i < warmup; i++) await fn(i)
  const samples: number[] = []
  for (let i = 0; i < n; i++) {
    const t0 = performance.now()
    await fn(i)
    samples.push(performance.now() - t0)
  }
  samples.sort((a, b) => a - b)
  const q = (x: number) => samples[Math.min(samples.length - 1, Math.floor(x * samples.length))] ?? NaN
  return { p50: q(0.5), p95: q(0.95), n }
}

const fmt = (s: Stats) => `p50 ${s.p50.toFixed(2).padStart(7)} ms   p95 ${s.p95.toFixed(2).padStart(7)} ms   (n=${s.n})`

async function main(): Promise<void> {
  const seed: KnowledgeBase = { ...loadKnowledgeBaseFromDirectory(join(process.cwd(), 'content-src')), version: { id: 'bench-seed', label: 'seed', status: 'draft' } }
  const generated: KnowledgeBase = { ...seed, rules: generateRules(GENERATED_RULES), version: { id: 'bench-generated', label: 'generated', status: 'draft' } }
  const facts = deriveFacts(RICH).facts

  const seedRich = await time(300, 100, () => rankDiagnosis(seed, RICH))
  const seedSparse = await time(300, 100, () => rankDiagnosis(seed, SPARSE))
  const suite = [...TUNING_SCENARIOS, ...HELD_OUT_SCENARIOS].map((sc) => sc.request)
  const seedSuite = await time(3 * suite.length, suite.length, (i) => rankDiagnosis(seed, suite[i % suite.length] as RankRequest))
  const genRank = await time(100, 10, () => rankDiagnosis(generated, RICH))

  const prepared = prepareKnowledgeBase(generated)
  const ours = await time(100, 10, () => runFindings(prepared, facts))
  const bareEngine = new Engine(generated.rules.map((r) => ({ name: r.name, conditions: r.conditions as never, event: { type: 'evidence', params: { id: r.name } } })), { allowUndefinedFacts: true })
  for (const [name, fn] of Object.entries(CUSTOM_OPERATORS)) bareEngine.addOperator(name, fn)
  const bare = await time(30, 5, () => bareEngine.run(facts))
  const evaluated = (await runFindings(prepared, facts)).evaluated

  console.log(`Seed base: ${seed.rules.length} findings (${prepareKnowledgeBase(seed).findings.length} after stage expansion)`)
  console.log(`  rankDiagnosis, rich cascade case   ${fmt(seedRich)}`)
  console.log(`  rankDiagnosis, sparse single case  ${fmt(seedSparse)}`)
  console.log(`  rankDiagnosis, the scenario suite  ${fmt(seedSuite)}   (${suite.length} cases, with tests and the next test)`)
  console.log(`Generated base: ${GENERATED_RULES} rules over ${FACT_SPECS.size} vocabulary facts; ${Object.keys(facts).length} facts present, ${evaluated} rules handed to json-rules-engine after the indexes`)
  console.log(`  rankDiagnosis, rich cascade case   ${fmt(genRank)}`)
  console.log(`  rule step, Rimecase (indexed)      ${fmt(ours)}`)
  console.log(`  rule step, bare json-rules-engine  ${fmt(bare)}`)
  console.log(`  speed-up: p50 ${(bare.p50 / ours.p50).toFixed(1)}×, p95 ${(bare.p95 / ours.p95).toFixed(1)}×; full ranking vs bare rule run alone: p50 ${(bare.p50 / genRank.p50).toFixed(1)}×`)
}

main().catch((e: unknown) => {
  console.error(e)
  process.exitCode = 1
})
