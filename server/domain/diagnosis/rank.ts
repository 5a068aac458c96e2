/**
 * Entry point of the diagnosis domain: request in, ranked causes and next tests out.
 * Pure apart from the per-version engine cache; the API layer validates the request with
 * rankRequestSchema first and maps RankInputError to a 400.
 */
import type { RankRequest, RankResponse, StageConfig } from '#shared/types/diagnosis'
import { prepareKnowledgeBase, runRules, sharpenWith } from './engine'
import { deriveFacts } from './facts'
import type { KnowledgeBase } from './knowledge-base'
import { proposeTests } from './next-test'
import { rankCauses, resolveTestResults, type RankOptions } from './ranking'

export { RankInputError, type LearnedCount, type RankOptions } from './ranking'

/** Proposals beyond the first few are never tried in practice; the list stops here. */
export const MAX_PROPOSED_TESTS = 8

export async function rankDiagnosis(kb: KnowledgeBase, request: RankRequest, options: RankOptions = {}): Promise<RankResponse> {
  const kind = request.unit.kind
  const done = resolveTestResults(kb, kind, request.testResults)
  const derived = deriveFacts(request)
  const run = await runRules(prepareKnowledgeBase(kb), derived.facts)
  const ranking = rankCauses(kb, kind, run.fired, done, options)
  const tests = proposeTests({
    kb,
    kind,
    hypotheses: ranking.hypotheses,
    posterior: ranking.posterior,
    done,
    readingsPresent: derived.readingsPresent,
  })
  const stages = new Set(request.unit.stages.map((s) => s.stage))
  return {
    causes: ranking.causes,
    tests: tests.slice(0, MAX_PROPOSED_TESTS),
    derived: derived.derived,
    warnings: derived.warnings,
    priorNote: ranking.priorNote,
    missingReadings: sharpenWith(run, derived.readingsPresent, kind, stages, unsuppliedByStageData(request.unit.stages)),
    knowledgeBaseVersion: kb.version,
  }
}

/** Standing-pressure comparisons need charge and volume, or a reference pair; without them no reading helps. */
function unsuppliedByStageData(stages: StageConfig[]): Set<string> {
  const out = new Set<string>()
  for (const s of stages) {
    const fromCharge = s.chargeG !== undefined && s.volumeL !== undefined
    const fromReference = s.referenceStandingPressureKpa !== undefined && s.referenceAmbientC !== undefined
    if (!fromCharge) out.add(`${s.stage}.standingChargePercent`)
    if (fromCharge || fromReference) continue
    for (const f of ['expectedStandingPressureKpa', 'standingRatio', 'standingPercentOfExpected', 'standingPhase']) out.add(`${s.stage}.${f}`)
  }
  return out
}
