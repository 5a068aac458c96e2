/**
 * Ranking a stored case again with a chosen knowledge-base version: the case's symptoms, readings
 * and test results (as they stand, or as they stood at some step of its timeline) become the same
 * rank request the case page made, and the version ranks it. Used by the impact of a draft on past
 * cases and by replays for training.
 */
import { rankRequestFor, type CaseState } from '#server/domain/cases/case-record'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'
import { orderCauses, rankDiagnosis, type OrderedCause, type RankOptions } from '#server/domain/diagnosis/rank'
import type { RankResponse } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'

/** What of a case a replay reads. */
export type StoredCaseFacts = Pick<CaseState, 'symptoms' | 'readings' | 'testResults'>

/** The full ranking (causes, next tests, derived quantities) of a stored case's facts with `kb`. */
export function rankStoredCase(kb: KnowledgeBase, unit: UnitDto, facts: StoredCaseFacts, options: RankOptions = {}): Promise<RankResponse> {
  return rankDiagnosis(kb, rankRequestFor(unit, facts), { equipmentClass: unit.equipmentClass, ...options })
}

/** The causes of a stored case's facts in each version's order, without evidence words (facts derived once): the impact replay. */
export function orderStoredCaseCauses(kbs: readonly KnowledgeBase[], unit: UnitDto, facts: StoredCaseFacts, options: RankOptions = {}): Promise<OrderedCause[][]> {
  return orderCauses(kbs, rankRequestFor(unit, facts), { equipmentClass: unit.equipmentClass, ...options })
}
