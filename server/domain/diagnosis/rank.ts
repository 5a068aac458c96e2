/**
 * Entry point of the diagnosis domain: request in, ranked causes and next tests out.
 * Pure apart from the per-version caches; the API layer validates the request with rankRequestSchema
 * first and maps RankInputError to a 400. Readings and test results of the repair and verification
 * phases are listed in `setAside` and never move the ranking.
 */
import type { Cause, RankRequest, RankResponse, Stage, StageConfig } from '#shared/types/diagnosis'
import { prepareKnowledgeBase, runFindings, sharpenWith } from './engine'
import { findingContributions, modelFor, orderHypotheses, rankHypotheses, testContributions, type KindModel } from './evidence'
import { deriveFacts } from './facts'
import { unitRecordFactor } from './hypotheses'
import type { KnowledgeBase } from './knowledge-base'
import { proposeTests } from './next-test'
import { priorsFor, type Priors, type RankOptions } from './priors'
import { resolveTestResults } from './test-results'

export { confirmationIsDefinitive, RankInputError } from './test-results'
export type { LearnedCount, RankOptions } from './priors'

/** Proposals beyond the first few are never tried in practice; the list stops here. */
export const MAX_PROPOSED_TESTS = 8

export async function rankDiagnosis(kb: KnowledgeBase, request: RankRequest, options: RankOptions = {}): Promise<RankResponse> {
  const kind = request.unit.kind
  const results = resolveTestResults(kb, kind, request.testResults)
  const derived = deriveFacts(request)
  const prepared = prepareKnowledgeBase(kb)
  const run = await runFindings(prepared, derived.facts)
  const model = modelFor(prepared, kb.causes, kind)
  const priors = startingOdds(kb, model, request, options)
  const tested = testContributions(model, results.diagnosis, run.applied, derived.facts)
  const ranking = rankHypotheses(model, kb.causes, priors.values, [...findingContributions(model, run.applied, derived.facts), ...tested.contributions])
  const meteringDevices = Object.fromEntries(request.unit.stages.flatMap((s) => (s.meteringDevice ? [[s.stage, s.meteringDevice]] : [])))
  const tests = proposeTests({ kb, model, kind, posterior: ranking.posterior, done: results.diagnosis, readingsPresent: derived.readingsPresent, meteringDevices, limit: MAX_PROPOSED_TESTS })
  const stages = new Set(request.unit.stages.map((s) => s.stage))
  return {
    causes: ranking.causes,
    tests,
    derived: derived.derived,
    warnings: [...derived.warnings, ...tested.warnings],
    priorNote: priors.note,
    setAside: [...derived.setAside, ...results.setAside],
    missingReadings: sharpenWith(run, derived.readingsPresent, kind, stages, unsuppliedByStageData(request.unit.stages)),
    knowledgeBaseVersion: kb.version,
  }
}

const PRIORS_KEPT = 256
const priorsMemo = new WeakMap<KindModel, Map<string, Priors>>()

/**
 * The starting odds of a request's unit. They depend only on the version's causes, the unit kind, the
 * unit record's factors, the equipment class and the learned counts, which repeat from one request
 * to the next; so they are kept per compiled model (one per version and kind), a bounded few.
 */
function startingOdds(kb: KnowledgeBase, model: KindModel, request: RankRequest, options: RankOptions): Priors {
  const factors = model.hypotheses.map((h) => unitRecordFactor(h, request.unit.stages))
  const key = `${options.equipmentClass ?? ''}|${factors.join(',')}|${JSON.stringify(options.learnedCounts ?? [])}`
  let memo = priorsMemo.get(model)
  if (!memo) priorsMemo.set(model, (memo = new Map()))
  const hit = memo.get(key)
  if (hit) return hit
  const priors = priorsFor(kb.causes, model.kind, model.hypotheses, options, factors)
  if (memo.size >= PRIORS_KEPT) memo.delete(memo.keys().next().value as string)
  memo.set(key, priors)
  return priors
}

/** Standing-pressure comparisons need charge and volume, or a reference pair; without them no reading helps. */
function unsuppliedByStageData(stages: StageConfig[]): Set<string> {
  const out = new Set<string>()
  for (const s of stages) {
    const fromCharge = s.chargeG !== undefined && s.volumeL !== undefined
    const fromReference = s.referenceStandingPressureKpa !== undefined && s.referenceAmbientC !== undefined
    if (!fromCharge) out.add(`${s.stage}.standingChargePercent`)
    if (fromCharge || fromReference) continue
    for (const f of ['expectedStandingPressureKpa', 'standingRatio', 'standingPercentOfExpected', 'standingResidualPct', 'standingUncertaintyPct', 'standingPhase']) out.add(`${s.stage}.${f}`)
  }
  return out
}

/** A cause in a replay's order, with its probability. */
export interface OrderedCause {
  cause: Cause
  stage?: Stage
  probability: number
}

/**
 * The causes of one request in the order each of several versions ranks them, with their
 * probabilities but without evidence lists, words or next tests: what replaying thousands of stored
 * cases needs. The facts are derived once and read by every version; the order and probabilities
 * are exactly those rankDiagnosis gives each version.
 */
export async function orderCauses(kbs: readonly KnowledgeBase[], request: RankRequest, options: RankOptions = {}): Promise<OrderedCause[][]> {
  const kind = request.unit.kind
  const derived = deriveFacts(request)
  const out: OrderedCause[][] = []
  for (const kb of kbs) {
    const results = resolveTestResults(kb, kind, request.testResults)
    const prepared = prepareKnowledgeBase(kb)
    const run = await runFindings(prepared, derived.facts)
    const model = modelFor(prepared, kb.causes, kind)
    const priors = startingOdds(kb, model, request, options)
    const tested = testContributions(model, results.diagnosis, run.applied, derived.facts)
    out.push(orderHypotheses(model, priors.values, [...findingContributions(model, run.applied, derived.facts, false), ...tested.contributions]))
  }
  return out
}
