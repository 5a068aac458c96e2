/**
 * Wire types of the refrigerant log (`/api/units/{id}/refrigerant-log`), cylinders, leak checks and the
 * list of compliance duties due. The figures come from server/domain/compliance.
 */
import type { ApplianceType, LeakRateAssessmentDto, LeakRateMethod, SourceRef } from './compliance'
import type { Stage } from './diagnosis'

/** Why refrigerant was added; the first charge, a retrofit and seasonal variance get no leak rate. */
export const ADDITION_PURPOSES = ['top-up', 'recharge', 'initial-charge', 'retrofit', 'seasonal-variance'] as const
export type AdditionPurpose = (typeof ADDITION_PURPOSES)[number]

/** Leak checks, repairs, verification tests and reports the log records beside its transactions. */
export const CHECK_KINDS = ['leak-check', 'repair', 'initial-verification', 'follow-up-verification', 'chronic-leak-report'] as const
export type CheckKind = (typeof CHECK_KINDS)[number]

/** A recovery cylinder takes refrigerant out of units; a supply cylinder charges it in. */
export const CYLINDER_PURPOSES = ['recovery', 'supply'] as const
export type CylinderPurpose = (typeof CYLINDER_PURPOSES)[number]

export interface LogEntryDto {
  index: number
  id?: string | number
  at: string
  day: string
  direction: 'added' | 'recovered'
  grams: number
  refrigerant: string
  cylinder: string | null
  technician: string | null
  caseId: string | number | null
  purpose: AdditionPurpose | null
  chargeAfterG: number
  countedAsLossG: number
  warnings: string[]
}

/** The leak rate after one addition (several lines for the same leak count as one). */
export interface AdditionEventDto {
  day: string
  entryIndexes: number[]
  caseId: string | number | null
  addedG: number
  countedAsLossG: number
  /** Days since refrigerant was last added (null for the first addition on record). */
  daysSinceLastAddition: number | null
  /** The days the annualizing method divided by. */
  daysUsed: number | null
  annualizingPercent: number | null
  rollingAveragePercent: number | null
  /** Why no leak rate was calculated, if none was. */
  exemptBecause: string | null
  note: string
  assessment: LeakRateAssessmentDto | null
}

export interface StageLogDto {
  stage: Stage
  refrigerant: string
  /** The nameplate charge; null when the register does not know it (then no leak rate). */
  fullChargeG: number | null
  entries: LogEntryDto[]
  additions: AdditionEventDto[]
  currentChargeG: number | null
  totalAddedG: number
  totalRecoveredG: number
  presumedLostG: number
  recoveredByCylinder: { cylinder: string; refrigerant: string; grams: number }[]
  warnings: string[]
}

/** The unit's charge under one EU F-gas regulation. */
export interface FGasViewDto {
  basis: string
  regulation: string
  circuits: { designation: string; chargeG: number; gwp: number | null; tonnesCo2e: number | null; fGas: boolean }[]
  annexITonnesCo2e: number
  leakCheckRequired: boolean
  leakCheckIntervalMonths: number | null
  hermeticExemption: boolean
  leakDetectionSystemRequired: boolean
  text: string[]
  sources: SourceRef[]
}

export interface ComplianceCheckDto {
  id: number
  kind: CheckKind
  stage: Stage | null
  passed: boolean
  at: string
  note: string
  caseId: number | null
  by: string | null
}

export interface UnitComplianceSettingsDto {
  applianceType: ApplianceType
  hermeticallySealed: boolean
  leakDetectionSystem: boolean
}

/** One compliance duty of a unit: what is due, by when, under which rule. */
export interface DutyDto {
  unitId: string | number
  unitName: string
  stage: Stage | null
  kind: 'repair' | 'verification-test' | 'leak-inspection' | 'leak-check' | 'recheck-after-repair' | 'chronic-leak-report'
  dueBy: string
  daysLeft: number
  overdue: boolean
  text: string
  citation: string
}

export interface UnitRefrigerantLogDto {
  unitId: number
  unitName: string
  jurisdiction: { id: string; name: string }
  leakRateMethod: LeakRateMethod
  settings: UnitComplianceSettingsDto
  stages: StageLogDto[]
  fGas: FGasViewDto[]
  checks: ComplianceCheckDto[]
  duties: DutyDto[]
}

export interface ComplianceSettingsDto {
  jurisdiction: string
  leakRateMethod: LeakRateMethod
  jurisdictions: { id: string; name: string; summary: string }[]
}

/** `GET /api/compliance/due`. */
export interface DueListDto {
  today: string
  jurisdiction: { id: string; name: string }
  horizonDays: number
  /** Duties overdue or falling due within the horizon, soonest first. */
  due: DutyDto[]
  /** Every open duty. */
  duties: DutyDto[]
  logWarnings: { unitId: string | number; stage: Stage; warnings: string[] }[]
}

export interface CylinderDto {
  id: number
  label: string
  refrigerant: string | null
  purpose: CylinderPurpose
  note: string
  recovered: { refrigerant: string; grams: number }[]
  charged: { refrigerant: string; grams: number }[]
  /** Grams recovered into it less grams charged from it (a recovery cylinder's contents by the log). */
  netG: number
  units: { id: number; name: string }[]
  warnings: string[]
}

export interface CylinderDetailDto extends CylinderDto {
  transactions: { id: number; at: string; unitId: number; unitName: string; stage: Stage; refrigerant: string; grams: number; direction: 'added' | 'recovered'; caseId: number | null; technician: string | null }[]
}
