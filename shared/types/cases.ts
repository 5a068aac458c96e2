import type { Cause, RankResponse, Reading, ReadingUnit, Stage, Symptom, TestResult } from './diagnosis'
import type { RepairStepRecord, Revision } from './repair-steps'
import type { UnitDto } from './equipment-dto'
import type { UploadDto } from './uploads'

export const CASE_STATUSES = ['open', 'closed'] as const
export type CaseStatus = (typeof CASE_STATUSES)[number]


/** A reading as the case stores it: the entered value and unit, when and by whom. */
export interface CaseReading extends Reading {
  at: string
  by: number | null
  /** Kept although far outside the unit's design envelope: what was unusual and the technician's reason. */
  confirmedOutside?: { message: string; reason: string }
  /** Struck out: kept in the record, left out of the diagnosis and shown struck in the report. */
  struck?: Revision
  /** Corrected: `value`/`unit` are the corrected figure, `from` what was first entered. */
  corrected?: Revision & { from: { value: number | boolean; unit: ReadingUnit } }
}
export interface CaseTestResult extends TestResult {
  stage?: Stage
  at: string
  by: number | null
  struck?: Revision
  corrected?: Revision & { from: { outcome: string } }
}

export const CASE_EVENT_TYPES = [
  'case-opened', 'symptoms-set', 'reading-entered', 'test-proposed', 'outcome-recorded', 'note', 'photo',
  'ranking-snapshot', 'case-closed', 'addendum', 'report-queued', 'report-sent', 'report-failed',
  'reading-struck', 'reading-corrected', 'outcome-struck', 'outcome-corrected', 'step-recorded', 'step-struck', 'report-photos-set', 'nameplate-changed',
] as const
export type CaseEventType = (typeof CASE_EVENT_TYPES)[number]

export interface CaseEventDto {
  id: number
  at: string
  type: CaseEventType
  by: string | null
  byUserId: number | null
  [key: string]: unknown
}

export interface RefrigerantTransactionDto {
  id?: number
  stage: Stage
  refrigerant: string
  grams: number
  direction: 'added' | 'recovered'
  cylinder: string
  at?: string
}

/** How a confirmed cause was settled: a definitive test, the repair that cured it, or judgement only. */
export const CONFIRMATION_BASES = ['test', 'repair', 'judgement'] as const
export type ConfirmationBasis = (typeof CONFIRMATION_BASES)[number]

export interface CaseClosure {
  confirmedCauses: { cause: Cause; stage?: Stage; basis?: ConfirmationBasis }[]
  workDone: string
  parts: string[]
  refrigerantTransactions: RefrigerantTransactionDto[]
  unitStateAtDeparture: string
  followUp: string
  closedBy: number | null
}


export interface EmailDto {
  id: number
  toAddress: string
  subject: string
  status: 'pending' | 'sent' | 'failed'
  attempts: number
  lastError: string | null
  sentAt: string | null
  /** The background job delivering it (`GET /api/jobs/{id}`); null for e-mails queued before jobs existed. */
  jobId: string | null
}

/** A case as `GET /api/cases/{id}` returns it (contract fields first). */
export interface CaseDto {
  id: number
  unitId: number
  status: CaseStatus
  complaint: string
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
  ranking: RankResponse | null
  events: CaseEventDto[]
  version: number
  technician: string | null
  openedAt: string
  closedAt: string | null
  notes: string
  closure: CaseClosure | null
  unit: UnitDto
  transactions: RefrigerantTransactionDto[]
  uploads: UploadDto[]
  emails: EmailDto[]
  /** Repair and verification steps (pressure hold, evacuation, hot work, recharge), in the order recorded. */
  steps: RepairStepRecord[]
  /** Uploads the technician chose to show in the report and its PDF. */
  reportPhotoIds: number[]
}

/** A row of the case list. */
export interface CaseListItem {
  id: number
  status: CaseStatus
  complaint: string
  unitId: number
  unitName: string
  customer: string
  technician: string | null
  openedAt: string
  closedAt: string | null
  confirmedCauses: { cause: Cause; stage?: Stage }[]
  topCause: { cause: Cause; stage?: Stage; probability: number } | null
}
