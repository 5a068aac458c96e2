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

/** What the trainer lets the trainee see at the start of an exercise; everything else must be asked for. */
export interface ExerciseStart {
  complaint: boolean
  symptoms: boolean
  readings: { quantity: Quantity; stage?: Stage }[]
}

/** The unit of an exercise: its technical description only, with invented stand-ins for every name. */
export interface ExerciseUnit {
  name: string
  customer: string
  site: string
  kind: UnitKind
  equipmentClass: EquipmentClass
  siteAltitudeM: number
  design: { cabinetC: number | null; cascadeHxC: number | null }
  stages: {
    stage: Stage
    refrigerant: string
    chargeG: number | null
    volumeL: number | null
    referenceStandingPressureKpa: number | null
    referenceAmbientC: number | null
    ratedCurrentA: number | null
  }[]
}

/** A test a trainee may ask for, with what it costs. */
export interface ExerciseTestChoice {
  test: TestSlug
  title: string
  minutes: number
  opensSystem: boolean
  hotWork: boolean
  stages: Stage[]
  safetyNotes: string[]
}

/** A recorded reading or outcome as the exercise keeps it. */
export interface ExerciseReading {
  quantity: Quantity
  stage?: Stage
  value: number | boolean
  unit: ReadingUnit
}

/** One step of the path the engine takes through the same case. */
export interface EngineStep {
  kind: 'reading' | 'test'
  quantity?: Quantity
  test?: TestSlug
  stage?: Stage
  minutes: number
}

/** `GET /api/exercises/{id}`: what a trainee sees at the start, and what they may ask for. */
export interface ExerciseDto {
  id: number
  title: string
  unit: ExerciseUnit
  complaint: string | null
  symptoms: Symptom[]
  startReadings: ExerciseReading[]
  tests: ExerciseTestChoice[]
  causes: { cause: Cause; title: string }[]
  readingMinutes: number
  createdAt: string
}

/** A row of the exercise list. `caseId`, `start` and `assignees` are filled for trainers only. */
export interface ExerciseSummaryDto {
  id: number
  title: string
  createdAt: string
  unitKind: UnitKind
  equipmentClass: EquipmentClass
  assignedToMe: boolean
  myAttempts: number
  attempts: number
  caseId: number | null
  start: ExerciseStart | null
  assignees: { id: number; name: string }[] | null
}

/** One request of an attempt and what the case had recorded for it. */
export interface AttemptRequestDto {
  kind: 'reading' | 'test'
  quantity?: Quantity
  test?: TestSlug
  stage?: Stage
  minutes: number
  /** False: the case did not record it ("not recorded"). */
  found: boolean
  value?: number | boolean
  unit?: ReadingUnit
  outcome?: string
  outcomeLabel?: string
  invasive: boolean
  at: string
}

export interface StageVerdict {
  stage: Stage
  expected: Cause
  named: Cause | null
  right: boolean
}

/** How an attempt was scored (points 0..100). */
export interface ExerciseScore {
  stages: StageVerdict[]
  rightStages: number
  minutesSpent: number
  engineMinutes: number
  needlessInvasive: { test: TestSlug; stage?: Stage }[]
  unsafe: { test: TestSlug; stage?: Stage }[]
  causePoints: number
  timePoints: number
  penalty: number
  points: number
}

/** A trainee's attempt at an exercise; `score` and `enginePath` once it is finished. */
export interface AttemptDto {
  id: number
  exerciseId: number
  exerciseTitle: string
  userId: number
  person: string
  startedAt: string
  finishedAt: string | null
  requests: AttemptRequestDto[]
  minutesSpent: number
  answer: { stage: Stage; cause: Cause }[] | null
  score: ExerciseScore | null
  enginePath: EngineStep[] | null
}

/** Counts of one group of confirmed cases: how many, and how many had a confirmed cause first / in the first three. */
export interface AccuracyCell {
  key: string
  cases: number
  top1: number
  top3: number
}

/** The published knowledge base's accuracy over the organisation's confirmed cases. */
export interface KbAccuracyDto {
  knowledgeBaseVersion: { id: number | string; label: string }
  overall: AccuracyCell
  byCause: AccuracyCell[]
  byEquipmentClass: AccuracyCell[]
  /** `key` is the closing month, "2026-11". */
  byMonth: AccuracyCell[]
  /** Cases whose confirmed cause was not ranked first, newest first. */
  wrong: {
    caseId: number
    unitName: string
    closedAt: string
    confirmed: { cause: Cause; stage?: Stage }[]
    rankOfConfirmed: number | null
    top: { cause: Cause; stage?: Stage; probability: number }[]
  }[]
}
