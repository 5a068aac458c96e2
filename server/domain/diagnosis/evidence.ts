/**
 * The evidence model: posterior(h) ∝ prior(h) × Π_groups Π_findings P(finding | h)^weight.
 *
 * Every finding gives a likelihood to every hypothesis through its table (likelihood.ts), so evidence
 * for one cause is, without further ado, evidence against the others, and a finding that fits nothing
 * raises `other`. Findings of one correlation group read one physical effect (head high, current high,
 * tripping): n of them count as 1 + (n − 1)·GROUP_INDEPENDENCE independent findings, shared equally,
 * so agreement adds little while a member that disagrees still speaks. A test whose outcome
 * follows from a reading already counted (the standing-pressure check beside a standing-pressure
 * reading) is not counted again. Likelihood matrices are compiled once per version and unit kind.
 */
import type { EvidenceItem, RankedCause, UnitKind } from '#shared/types/diagnosis'
import { renderText, type PreparedKnowledgeBase } from './engine'
import type { Facts } from './fact-sheet'
import { hypothesesFor, type Hypothesis } from './hypotheses'
import type { CauseDef, TestDef } from './knowledge-base'
import { anyDensity, bandLikelihoods, bandOf, predictionWeights, resolveEntry, type BandPrediction } from './likelihood'
import type { PreparedFinding } from './rule-expansion'
import type { ResolvedTestResult } from './test-results'

/** Share of readings that are blunders (wrong probe, wrong stage, typo): no reading is ever impossible under a hypothesis. */
export const ROBUST_MIX = 0.03
/** How much each further finding of one correlation group adds, as a share of an independent finding. */
export const GROUP_INDEPENDENCE = 0.25
/** Smallest probability a categorical finding or test outcome may take under any hypothesis. */
export const CATEGORICAL_FLOOR = 0.002
/** A finding shows as evidence for or against a cause when it moves its odds by at least this factor. */
const EVIDENCE_SHOWN_FROM = 1.5
const EVIDENCE_SHOWN_MAX = 6

interface CompiledFinding {
  /** Categorical findings: log-likelihood per hypothesis. */
  logL?: Float64Array
  /** Graded findings: band weights per hypothesis (row-major, hypotheses × bands) and the `any` weight. */
  weights?: Float64Array
  anyW?: Float64Array
  /** Band weights of the healthy entry, for a wrong-refrigerant stage re-derived with the refrigerant that fits. */
  healthyWeights?: number[]
  healthyAny?: number
}

export interface KindModel {
  kind: UnitKind
  hypotheses: Hypothesis[]
  findings: Map<string, CompiledFinding>
  /** Per test and stage: log P(outcome | h) rows, and the same as probabilities. */
  tests: Map<string, { logs: Float64Array[]; probs: Float64Array[] }>
}

export function modelFor(prepared: PreparedKnowledgeBase, causes: CauseDef[], kind: UnitKind): KindModel {
  const hit = prepared.models.get(kind) as KindModel | undefined
  if (hit) return hit
  const model: KindModel = { kind, hypotheses: hypothesesFor(causes, kind), findings: new Map(), tests: new Map() }
  prepared.models.set(kind, model)
  return model
}

function compileFinding(model: KindModel, f: PreparedFinding): CompiledFinding {
  const hit = model.findings.get(f.id)
  if (hit) return hit
  const H = model.hypotheses.length
  let compiled: CompiledFinding
  if (f.measure) {
    const nb = f.measure.bands.names.length
    const weights = new Float64Array(H * nb)
    const anyW = new Float64Array(H)
    model.hypotheses.forEach((h, i) => {
      const prediction = resolveEntry(f.likelihoods, h, f.about, model.kind) as BandPrediction
      const w = predictionWeights(prediction, f.measure!.bands)
      w.weights.forEach((x, b) => (weights[i * nb + b] = x))
      anyW[i] = w.any
    })
    const healthy = predictionWeights(f.likelihoods.healthy as BandPrediction, f.measure.bands)
    compiled = { weights, anyW, healthyWeights: healthy.weights, healthyAny: healthy.any }
  } else {
    const logL = new Float64Array(H)
    model.hypotheses.forEach((h, i) => (logL[i] = Math.log(Math.max(resolveEntry(f.likelihoods, h, f.about, model.kind) as number, CATEGORICAL_FLOOR))))
    compiled = { logL }
  }
  model.findings.set(f.id, compiled)
  return compiled
}

export interface Measured {
  value: number
  sigma: number
  band: string
}

/** The value a graded finding reads, its total uncertainty and the band it falls in. */
export function measuredValue(f: PreparedFinding, facts: Facts): Measured | undefined {
  if (!f.measure) return undefined
  const value = facts[f.measure.fact]
  if (typeof value !== 'number') return undefined
  const u = f.measure.uncertainty ? facts[f.measure.uncertainty] : undefined
  const sigma = Math.sqrt(f.measure.sigma ** 2 + (typeof u === 'number' ? u * u : 0))
  return { value, sigma, band: bandOf(f.measure.bands, value) }
}

/** log P(finding | h) for every hypothesis. */
export function findingLogLikelihoods(model: KindModel, f: PreparedFinding, facts: Facts): Float64Array | undefined {
  const compiled = compileFinding(model, f)
  if (compiled.logL) return compiled.logL
  const m = measuredValue(f, facts)
  if (!m || !f.measure || !compiled.weights || !compiled.anyW) return undefined
  const bands = f.measure.bands
  const bandL = bandLikelihoods(bands, m.value, m.sigma)
  const any = anyDensity(bands)
  const nb = bandL.length
  const out = new Float64Array(model.hypotheses.length)
  for (let i = 0; i < out.length; i++) {
    let l = (compiled.anyW[i] as number) * any
    for (let b = 0; b < nb; b++) l += (compiled.weights[i * nb + b] as number) * (bandL[b] as number)
    out[i] = Math.log((1 - ROBUST_MIX) * l + ROBUST_MIX * any)
  }
  // The stage's readings were worked out with the refrigerant that fits them: with that charge the
  // circuit is otherwise healthy under the wrong-refrigerant hypothesis.
  if (f.about && !f.nameplateCurve && facts[`${f.about}.refrigerantMismatch`] === true && compiled.healthyWeights) {
    const i = model.hypotheses.findIndex((h) => h.cause === 'wrong-refrigerant' && h.stage === f.about)
    if (i >= 0) {
      let l = (compiled.healthyAny ?? 0) * any
      compiled.healthyWeights.forEach((w, b) => (l += w * (bandL[b] as number)))
      out[i] = Math.log((1 - ROBUST_MIX) * l + ROBUST_MIX * any)
    }
  }
  return out
}

/** log P(outcome | h) and P(outcome | h) for each outcome of a test done on a stage, built once per version. */
export function testLikelihoods(model: KindModel, test: TestDef, stage: ResolvedTestResult['stage']): { logs: Float64Array[]; probs: Float64Array[] } {
  const key = `${test.slug}@${stage}`
  const hit = model.tests.get(key)
  if (hit) return hit
  const probs = test.outcomes.map((o) => Float64Array.from(model.hypotheses, (h) => Math.max(resolveEntry(o.likelihoods, h, stage, model.kind) ?? 0, CATEGORICAL_FLOOR)))
  const entry = { probs, logs: probs.map((row) => row.map(Math.log)) }
  model.tests.set(key, entry)
  return entry
}

// ------------------------------------------------------------------ combination

export interface Contribution {
  id: string
  group: string
  logL: Float64Array
  text: string
  weight: number
}

/** Groups findings by physical effect: n findings of one group weigh as 1 + (n − 1)·GROUP_INDEPENDENCE, shared equally. */
export function weighGroups(contributions: Contribution[]): void {
  const sizes = new Map<string, number>()
  for (const c of contributions) sizes.set(c.group, (sizes.get(c.group) ?? 0) + 1)
  for (const c of contributions) {
    const n = sizes.get(c.group) ?? 1
    c.weight = (1 + (n - 1) * GROUP_INDEPENDENCE) / n
  }
}

export function softmax(logs: Float64Array | number[]): number[] {
  let max = -Infinity
  for (const l of logs) if (l > max) max = l
  const ex = Array.from(logs, (l) => (Number.isFinite(l) ? Math.exp(l - max) : 0))
  const sum = ex.reduce((a, b) => a + b, 0)
  return ex.map((x) => x / sum)
}

export interface Ranking {
  hypotheses: Hypothesis[]
  posterior: number[]
  causes: RankedCause[]
}

/** Posterior over the hypotheses (groups weighed first); a hypothesis with prior 0 stays at 0. */
function posteriorOf(H: number, priors: number[], contributions: Contribution[]): number[] {
  weighGroups(contributions)
  const logPost = new Float64Array(H)
  for (let i = 0; i < H; i++) logPost[i] = (priors[i] as number) > 0 ? Math.log(priors[i] as number) : -Infinity
  for (const c of contributions) for (let i = 0; i < H; i++) logPost[i] = (logPost[i] as number) + c.weight * (c.logL[i] as number)
  return softmax(logPost)
}

/** The order rankHypotheses puts the causes in: most probable first, ties by cause and stage. */
function byProbability(a: { cause: string; stage?: string; probability: number }, b: { cause: string; stage?: string; probability: number }): number {
  return b.probability - a.probability || `${a.cause}@${a.stage ?? ''}`.localeCompare(`${b.cause}@${b.stage ?? ''}`)
}

/**
 * Only the order of the live hypotheses, most likely first, exactly as rankHypotheses ranks them but
 * without the evidence lists and their words: what replaying many stored cases needs.
 */
export function orderHypotheses(model: KindModel, priors: number[], contributions: Contribution[]): { cause: Hypothesis['cause']; stage?: Hypothesis['stage']; probability: number }[] {
  const posterior = posteriorOf(model.hypotheses.length, priors, contributions)
  const out: { cause: Hypothesis['cause']; stage?: Hypothesis['stage']; probability: number }[] = []
  model.hypotheses.forEach((h, i) => {
    if ((priors[i] as number) > 0) out.push(h.stage ? { cause: h.cause, stage: h.stage, probability: posterior[i] ?? 0 } : { cause: h.cause, probability: posterior[i] ?? 0 })
  })
  return out.sort(byProbability)
}

/** Posterior over the hypotheses, and for each the findings that moved it most, in words. */
export function rankHypotheses(model: KindModel, causes: CauseDef[], priors: number[], contributions: Contribution[]): Ranking {
  const H = model.hypotheses.length
  const live = priors.map((p) => p > 0)
  const posterior = posteriorOf(H, priors, contributions)
  const titles = new Map(causes.map((c) => [c.slug, c.title]))
  const shown = contributions.filter((c) => c.weight > 0)
  const means = shown.map((c) => priorWeightedLog(c.logL, priors))
  const threshold = Math.log(EVIDENCE_SHOWN_FROM)
  const ranked: RankedCause[] = []
  for (let i = 0; i < H; i++) {
    if (!live[i]) continue
    const h = model.hypotheses[i] as Hypothesis
    const evidence: { c: Contribution; s: number }[] = []
    const against: { c: Contribution; s: number }[] = []
    for (let k = 0; k < shown.length; k++) {
      const c = shown[k] as Contribution
      const s = c.weight * ((c.logL[i] as number) - (means[k] as number))
      if (s >= threshold) evidence.push({ c, s })
      else if (s <= -threshold) against.push({ c, s })
    }
    ranked.push({
      cause: h.cause,
      ...(h.stage ? { stage: h.stage } : {}),
      probability: posterior[i] ?? 0,
      title: titles.get(h.cause) ?? h.cause,
      prior: priors[i] ?? 0,
      evidence: strongest(evidence),
      evidenceAgainst: strongest(against),
    })
  }
  ranked.sort(byProbability)
  return { hypotheses: model.hypotheses, posterior, causes: ranked }
}

/** The findings that moved a cause most, strongest first, as people read them. */
function strongest(xs: { c: Contribution; s: number }[]): EvidenceItem[] {
  if (xs.length > 1) xs.sort((a, b) => Math.abs(b.s) - Math.abs(a.s))
  const out: EvidenceItem[] = []
  for (let k = 0; k < xs.length && k < EVIDENCE_SHOWN_MAX; k++) {
    const { c, s } = xs[k] as { c: Contribution; s: number }
    out.push({ rule: c.id, text: c.text, factor: Number(Math.exp(s).toPrecision(2)) })
  }
  return out
}

/** log of the prior-weighted average likelihood: the yardstick a cause's own likelihood is compared with. */
function priorWeightedLog(logL: Float64Array, priors: number[]): number {
  let max = -Infinity
  for (const l of logL) if (l > max) max = l
  let sum = 0
  for (let i = 0; i < logL.length; i++) sum += (priors[i] ?? 0) * Math.exp((logL[i] as number) - max)
  return max + Math.log(sum)
}

// ------------------------------------------------------------------ contributions

/** The finding's text for the band its value falls in (graded) or its one text. */
export function findingText(f: PreparedFinding, facts: Facts): string {
  const band = measuredValue(f, facts)?.band
  const template = (band && f.because[band]) ?? f.because['*'] ?? Object.values(f.because)[0] ?? f.name
  return renderText(template, facts)
}

/** Each applied finding's log-likelihoods; `withText: false` leaves the words out (a replay that only orders causes). */
export function findingContributions(model: KindModel, applied: PreparedFinding[], facts: Facts, withText = true): Contribution[] {
  const out: Contribution[] = []
  for (const f of applied) {
    const logL = findingLogLikelihoods(model, f, facts)
    if (logL) out.push({ id: f.id, group: f.group, logL, text: withText ? findingText(f, facts) : '', weight: 1 })
  }
  return out
}

const STAGE_WORDS = { high: 'high stage', low: 'low stage', single: 'system' } as const

export interface TestContributions {
  contributions: Contribution[]
  /** Where a recorded outcome and the reading of the same measurement disagree, in words. */
  warnings: string[]
}

/**
 * Test outcomes as contributions. An outcome whose measurement a reading already supplies, and which
 * agrees with it, adds nothing and is left out (the reading is the more precise of the two). When the
 * two disagree they were taken at different moments: both count, and a warning says so.
 */
export function testContributions(model: KindModel, results: ResolvedTestResult[], applied: PreparedFinding[], facts: Facts): TestContributions {
  const out: Contribution[] = []
  const warnings: string[] = []
  for (const r of results) {
    const same = r.test.sameMeasurementAs
    const reading = same ? applied.find((f) => same.findings.includes(f.name) && f.stage === r.stage) : undefined
    if (reading) {
      const band = measuredValue(reading, facts)?.band
      const agrees = !band || !same?.bands?.[r.outcome.slug] || same.bands[r.outcome.slug]?.includes(band)
      if (agrees) continue
      warnings.push(
        `The ${r.test.title.toLowerCase()} on the ${STAGE_WORDS[r.stage]} was recorded as "${r.outcome.label}", but the reading says otherwise (${findingText(reading, facts)}) Both count, as if taken at different moments; check which one is current.`,
      )
    }
    const index = r.test.outcomes.indexOf(r.outcome)
    const logL = testLikelihoods(model, r.test, r.stage).logs[index]
    if (!logL) continue
    out.push({
      id: `test:${r.test.slug}@${r.stage}`,
      group: `test:${r.test.slug}@${r.stage}`,
      logL,
      text: `${r.test.title} on the ${STAGE_WORDS[r.stage]}: ${r.outcome.label.charAt(0).toLowerCase()}${r.outcome.label.slice(1)}.`,
      weight: 1,
    })
  }
  return { contributions: out, warnings }
}
