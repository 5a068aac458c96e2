/**
 * The scenario suite and its scoring: top-1 and top-2 agreement of the ranking with the cause each
 * scenario was built from, under a given prior regime (no history, or an organisation's history).
 */
import type { RankResponse } from '#shared/types/diagnosis'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import type { LearnedCount } from '#server/domain/diagnosis/priors'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { buildScenario, type Scenario } from './builder'
import { HELD_OUT } from './held-out'
import { TUNING } from './tuning'

export const TUNING_SCENARIOS: Scenario[] = TUNING.map(buildScenario)
export const HELD_OUT_SCENARIOS: Scenario[] = HELD_OUT.map(buildScenario)

export interface ScenarioResult {
  scenario: Scenario
  ranked: string[]
  rank: number
  top: number
}

export interface SuiteScore {
  total: number
  top1: number
  top2: number
  results: ScenarioResult[]
}

export const hypothesisLabel = (c: { cause: string; stage?: string }) => (c.stage ? `${c.cause}@${c.stage}` : c.cause)

/** Counts per equipment class for the "organisation with history" regime. */
export type HistoryByClass = (equipmentClass: string) => LearnedCount[]

export async function scoreSuite(kb: KnowledgeBase, scenarios: Scenario[], history?: HistoryByClass): Promise<SuiteScore> {
  const results: ScenarioResult[] = []
  for (const scenario of scenarios) {
    const response: RankResponse = await rankDiagnosis(kb, scenario.request, {
      equipmentClass: scenario.equipmentClass,
      learnedCounts: history ? history(scenario.equipmentClass) : [],
    })
    const ranked = response.causes.map(hypothesisLabel)
    const want = hypothesisLabel(scenario.expected)
    results.push({ scenario, ranked, rank: ranked.indexOf(want) + 1, top: response.causes[0]?.probability ?? 0 })
  }
  const hit = (n: number) => results.filter((r) => r.rank >= 1 && r.rank <= n).length
  return { total: results.length, top1: hit(1), top2: hit(2), results }
}
