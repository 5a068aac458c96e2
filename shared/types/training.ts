// Training: case replays, exercises made from closed cases, trainees' attempts and their scores,
// and the knowledge base's accuracy over confirmed cases.
import type { CaseEventDto } from './cases'
import type { Cause, EvidenceItem, Quantity, ReadingUnit, Stage, TestSlug, UnitKind } from './diagnosis'
import type { EquipmentClass } from './equipment'

/** One hypothesis of a replayed ranking. */
export interface ReplayCause {
  cause: Cause
  stage?: Stage
  probability: number
  title: string
  evidence: EvidenceItem[]
}

/** A test the replayed ranking proposed at that step. */
export interface ReplayTest {
  test: TestSlug
  stage: Stage
  title: string
  minutes: number
  value: string
  opensSystem: boolean
}

/** One step of `GET /api/cases/{id}/replay`: an event that changed what was known, and the ranking after it. */
export interface ReplayStep {
  at: string
  event: CaseEventDto
  ranking: {
    causes: ReplayCause[]
    tests: ReplayTest[]
    knowledgeBaseVersion: { id: string | number; label: string; status: 'draft' | 'published' }
    warnings: string[]
  }
  /** Set when the version the case recorded for this step could not be used and the published one ranked it instead. */
  versionNote: string | null
  /** The top causes the case recorded at the time, for comparison; null when it recorded none. */
  recorded: { cause: string; stage?: string; probability: number }[] | null
}

export interface CaseReplayDto {
  caseId: number
  status: 'open' | 'closed'
  complaint: string
  unit: { id: number; name: string; kind: UnitKind; equipmentClass: EquipmentClass; stages: { stage: Stage; refrigerant: string }[] }
  confirmedCauses: { cause: Cause; stage?: Stage }[]
  /** How the starting odds of every step were set, in words. */
  priorNote: string
  steps: ReplayStep[]
}
