/**
 * Bayesian combination of evidence over cause×stage hypotheses (naive-Bayes in odds form):
 *   posterior(h) ∝ prior(h) × Π likelihood ratios of the rules that fired for h × Π P(outcome | h)
 * with an explicit `other` hypothesis that absorbs everything the knowledge base does not name.
 */
import type { Cause, EvidenceItem, RankedCause, Stage, TestResult, UnitKind } from '#shared/types/diagnosis'
import { STAGES_OF_KIND } from '#shared/schemas/diagnosis'
import type { FiredRule } from './engine'
import { outcomeLikelihood, type CauseDef, type KnowledgeBase, type PriorWeight, type TestDef, type TestOutcomeDef } from './knowledge-base'

export interface Hypothesis {
  key: string
  cause: Cause
  stage?: Stage
}

export interface LearnedCount {
  cause: Cause
  stage?: Stage
  count: number
}

export interface RankOptions {
  /** Confirmed causes of this organisation's closed cases of the same equipment class. */
  learnedCounts?: LearnedCount[]
  /** Label of the equipment class the counts come from; defaults to the unit kind. */
  equipmentClass?: string
}

/** How many closed cases the default priors are worth in the Dirichlet update (common practice: modest trust). */
export const PRIOR_STRENGTH = 20
/** Later rules of one subject pointing the same way mostly re-read the same physical effect. */
export const SAME_SUBJECT_DAMPING = 0.5
/** No test outcome is taken as impossible: readings and observations can be wrong. */
export const LIKELIHOOD_FLOOR = 0.001

export function hypothesisKey(cause: Cause, stage?: Stage): string {
  return stage ? `${cause}@${stage}` : cause
}

export function hypothesesFor(kb: Pick<KnowledgeBase, 'causes'>, kind: UnitKind): Hypothesis[] {
  const unitStages = STAGES_OF_KIND[kind]
  return kb.causes.flatMap((c): Hypothesis[] => {
    if (c.slug === 'other') return [{ key: 'other', cause: 'other' }]
    return c.stages.filter((s) => unitStages.includes(s)).map((stage) => ({ key: hypothesisKey(c.slug, stage), cause: c.slug, stage }))
  })
}

// ------------------------------------------------------------------ priors

function weightFor(w: PriorWeight, stage: Stage | undefined, stagesInUnit: number): number {
  if (typeof w === 'number') return w / Math.max(1, stagesInUnit)
  return stage ? (w[stage] ?? 0) : 0
}

function defaultPriors(causes: CauseDef[], hyps: Hypothesis[], kind: UnitKind): number[] {
  const byCause = new Map(causes.map((c) => [c.slug, c]))
  const stagesOf = (cause: Cause) => hyps.filter((h) => h.cause === cause).length
  const raw = hyps.map((h) => {
    const def = byCause.get(h.cause)
    return def ? weightFor(def.priors[kind], h.stage, stagesOf(h.cause)) : 0
  })
  return normalise(raw.map((x) => Math.max(x, 1e-4)))
}

export interface Priors {
  values: number[]
  note: string
}

/**
 * Dirichlet (Laplace-style) update: the defaults act as PRIOR_STRENGTH pseudo-cases, to which
 * the organisation's confirmed causes are added, so a team's own history shifts the start point
 * without ever locking out a cause it has not seen yet.
 */
export function priorsFor(kb: Pick<KnowledgeBase, 'causes'>, kind: UnitKind, hyps: Hypothesis[], options: RankOptions = {}): Priors {
  const base = defaultPriors(kb.causes, hyps, kind)
  const equipmentClass = options.equipmentClass ?? kind
  const counts = new Map<string, number>()
  for (const lc of options.learnedCounts ?? []) {
    const key = lc.cause === 'other' ? 'other' : hypothesisKey(lc.cause, lc.stage)
    if (!hyps.some((h) => h.key === key) || !(lc.count > 0)) continue
    counts.set(key, (counts.get(key) ?? 0) + lc.count)
  }
  const total = [...counts.values()].reduce((a, b) => a + b, 0)
  if (total === 0) {
    return { values: base, note: `Starting odds: Rimecase default weights for ${equipmentClass} units; no closed cases of this class to learn from yet.` }
  }
  const values = hyps.map((h, i) => (PRIOR_STRENGTH * (base[i] ?? 0) + (counts.get(h.key) ?? 0)) / (PRIOR_STRENGTH + total))
  return {
    values,
    note: `Starting odds: Rimecase default weights for ${equipmentClass} units, updated with ${total} confirmed cause(s) from your organisation's closed ${equipmentClass} cases (Dirichlet update; the defaults count as ${PRIOR_STRENGTH} cases).`,
  }
}

// ------------------------------------------------------------------ test evidence

export interface ResolvedTestResult {
  test: TestDef
  stage: Stage
  outcome: TestOutcomeDef
}

/** P(outcome | h) for a test done on `stage`; a fault on another stage looks like `other` to it. */
export function testLikelihood(outcome: TestOutcomeDef, testStage: Stage, h: Hypothesis): number {
  const sameStage = h.stage === undefined || h.stage === testStage
  const p = sameStage ? outcomeLikelihood(outcome.likelihoods, h.cause) : outcomeLikelihood(outcome.likelihoods, 'other')
  return Math.max(p, LIKELIHOOD_FLOOR)
}

export class RankInputError extends Error {
  constructor(readonly issues: string[]) {
    super(issues.join('; '))
    this.name = 'RankInputError'
  }
}

function resolveStage(test: TestDef, given: Stage | undefined, kind: UnitKind): Stage | string {
  const possible = test.stages.filter((s) => STAGES_OF_KIND[kind].includes(s))
  if (given) return possible.includes(given) ? given : `${test.slug} does not apply to the ${given} stage; allowed: ${possible.join(', ')}`
  if (possible.length === 1 && possible[0]) return possible[0]
  return `${test.slug} needs a stage on a ${kind} unit; allowed: ${possible.join(', ')}`
}

/** Checks outcome words against each test's own list; problems are returned together for one 400. */
export function resolveTestResults(kb: Pick<KnowledgeBase, 'tests'>, kind: UnitKind, results: TestResult[] = []): ResolvedTestResult[] {
  const issues: string[] = []
  const resolved: ResolvedTestResult[] = []
  results.forEach((r, i) => {
    const test = kb.tests.find((t) => t.slug === r.test)
    if (!test) return void issues.push(`testResults[${i}]: test "${r.test}" is not in this knowledge base`)
    const outcome = test.outcomes.find((o) => o.slug === r.outcome)
    if (!outcome) {
      return void issues.push(`testResults[${i}]: Unknown outcome "${r.outcome}" for ${r.test}; allowed: ${test.outcomes.map((o) => o.slug).join(', ')}`)
    }
    const stage = resolveStage(test, r.stage, kind)
    if (!STAGES_OF_KIND[kind].includes(stage as Stage)) return void issues.push(`testResults[${i}]: ${stage}`)
    resolved.push({ test, stage: stage as Stage, outcome })
  })
  if (issues.length) throw new RankInputError(issues)
  return resolved
}

// ------------------------------------------------------------------ combination

export function normalise(xs: number[]): number[] {
  const sum = xs.reduce((a, b) => a + b, 0)
  return sum > 0 ? xs.map((x) => x / sum) : xs.map(() => 1 / xs.length)
}

/** Posterior from log-weights, shifted by the maximum so that tiny numbers do not underflow. */
export function softmax(logs: number[]): number[] {
  const max = Math.max(...logs)
  return normalise(logs.map((l) => Math.exp(l - max)))
}

interface HypothesisEvidence {
  logWeight: number
  evidence: EvidenceItem[]
  evidenceAgainst: EvidenceItem[]
}

function ruleContribution(fired: FiredRule[], ev: HypothesisEvidence): void {
  const seen = new Map<string, number>()
  const ordered = [...fired].sort((a, b) => Math.abs(Math.log(b.rule.likelihoodRatio)) - Math.abs(Math.log(a.rule.likelihoodRatio)) || a.rule.id.localeCompare(b.rule.id))
  for (const f of ordered) {
    const lr = f.rule.likelihoodRatio
    const direction = `${f.rule.subject}:${lr >= 1 ? '+' : '-'}`
    const n = seen.get(direction) ?? 0
    seen.set(direction, n + 1)
    ev.logWeight += Math.log(lr) * (n === 0 ? 1 : SAME_SUBJECT_DAMPING)
    const item = { rule: f.rule.id, text: f.text }
    if (lr >= 1) ev.evidence.push(item)
    else ev.evidenceAgainst.push(item)
  }
}

const STAGE_PHRASE: Record<Stage, string> = { high: 'high stage', low: 'low stage', single: 'system' }

function testContribution(results: ResolvedTestResult[], h: Hypothesis, ev: HypothesisEvidence): void {
  for (const r of results) {
    const p = testLikelihood(r.outcome, r.stage, h)
    ev.logWeight += Math.log(p)
    const ratio = p / Math.max(outcomeLikelihood(r.outcome.likelihoods, 'other'), LIKELIHOOD_FLOOR)
    if (h.cause === 'other' || Math.abs(Math.log(ratio)) < 0.05) continue
    const item = {
      rule: `test:${r.test.slug}@${r.stage}`,
      text: `${r.test.title} on the ${STAGE_PHRASE[r.stage]}: "${r.outcome.label}" is ${ratio >= 1 ? ratio.toFixed(1) : ratio.toFixed(2)}× as likely with this cause as without it.`,
    }
    if (ratio >= 1) ev.evidence.push(item)
    else ev.evidenceAgainst.push(item)
  }
}

export interface Ranking {
  hypotheses: Hypothesis[]
  posterior: number[]
  causes: RankedCause[]
  priorNote: string
}

export function rankCauses(
  kb: Pick<KnowledgeBase, 'causes'>,
  kind: UnitKind,
  fired: FiredRule[],
  testResults: ResolvedTestResult[],
  options: RankOptions = {},
): Ranking {
  const hypotheses = hypothesesFor(kb, kind)
  const priors = priorsFor(kb, kind, hypotheses, options)
  const titles = new Map(kb.causes.map((c) => [c.slug, c.title]))
  const evidence = hypotheses.map((h, i) => {
    const ev: HypothesisEvidence = { logWeight: Math.log(priors.values[i] ?? 1e-9), evidence: [], evidenceAgainst: [] }
    ruleContribution(fired.filter((f) => f.rule.cause === h.cause && f.rule.stage === h.stage), ev)
    testContribution(testResults, h, ev)
    return ev
  })
  const posterior = softmax(evidence.map((e) => e.logWeight))
  const causes = hypotheses
    .map((h, i): RankedCause => ({
      cause: h.cause,
      ...(h.stage ? { stage: h.stage } : {}),
      probability: posterior[i] ?? 0,
      title: titles.get(h.cause) ?? h.cause,
      prior: priors.values[i] ?? 0,
      evidence: evidence[i]?.evidence ?? [],
      evidenceAgainst: evidence[i]?.evidenceAgainst ?? [],
    }))
    .sort((a, b) => b.probability - a.probability || hypothesisKey(a.cause, a.stage).localeCompare(hypothesisKey(b.cause, b.stage)))
  return { hypotheses, posterior, causes, priorNote: priors.note }
}
