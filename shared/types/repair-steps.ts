// Structured repair and verification steps of a case: what the technician did to the system after
// finding the fault, with the figures that show it was done right. Inputs are as entered (pressures
// with their measurement unit); results are computed by server/domain/cases/repair-steps.ts when
// the step is recorded and stored beside them, so the report shows what was judged at the time.
import type { PressureReadingUnit, Stage, TemperatureReadingUnit } from './diagnosis'
import type { VacuumUnit } from '#shared/utils/properties'

/** Who struck out or corrected an entry, when and why. The timeline keeps the change as its own event. */
export interface Revision {
  at: string
  by: number | null
  reason: string
}

export const REPAIR_STEP_KINDS = ['pressure-hold', 'evacuation', 'hot-work', 'recharge'] as const
export type RepairStepKind = (typeof REPAIR_STEP_KINDS)[number]

/** Test gases for a pressure hold: dry nitrogen, or nitrogen with 5 % hydrogen as a trace gas. Never oxygen or air. */
export const HOLD_GASES = ['nitrogen', 'nitrogen-hydrogen'] as const
export type HoldGas = (typeof HOLD_GASES)[number]

export interface PressureHoldInput {
  kind: 'pressure-hold'
  stage: Stage
  gas: HoldGas
  pressureUnit: PressureReadingUnit
  testPressure: number
  startPressure: number
  endPressure: number
  temperatureUnit: TemperatureReadingUnit
  startTemperature: number
  endTemperature: number
  holdMinutes: number
  note?: string
}

export interface EvacuationInput {
  kind: 'evacuation'
  stage: Stage
  vacuumUnit: VacuumUnit
  target: number
  reached: number
  /** Minutes the stage stood isolated from the pump. */
  decayMinutes: number
  /** Vacuum read at the end of that time. */
  afterDecay: number
  note?: string
}

/** The checks before brazing on a system; on a stage that held a flammable refrigerant every one is required. */
export const HOT_WORK_CHECKS = ['recovered', 'purgedWithNitrogen', 'atmosphereChecked', 'permit', 'nitrogenFlowWhileBrazing', 'extinguisher'] as const
export type HotWorkCheck = (typeof HOT_WORK_CHECKS)[number]

export interface HotWorkInput {
  kind: 'hot-work'
  stage: Stage
  /** What was brazed or cut, in the technician's words. */
  task: string
  checklist: Record<HotWorkCheck, boolean>
  note?: string
}

export const RECHARGE_METHODS = ['scale', 'standing-pressure'] as const
export type RechargeMethod = (typeof RECHARGE_METHODS)[number]

export interface RechargeInput {
  kind: 'recharge'
  stage: Stage
  method: RechargeMethod
  /** The refrigerant charged; the stage's nameplate one unless it was refilled with another. */
  refrigerant?: string
  /** Grams weighed in on the scale. */
  grams?: number
  /** Grams already in the stage before this weighing (0 for an evacuated stage). */
  startGrams?: number
  /** Grams the stage should hold; the nameplate charge unless given. */
  targetGrams?: number
  /**
   * Standing pressure read after charging, settled, with the ambient. By scale, the ambient (and the
   * unit) give the standing pressure to expect for the grams weighed in.
   */
  pressure?: number
  pressureUnit?: PressureReadingUnit
  ambientC?: number
  cylinder?: string
  note?: string
}

export type RepairStepInput = PressureHoldInput | EvacuationInput | HotWorkInput | RechargeInput

export interface StepFigure {
  label: string
  value: string
}

/** What a step showed: pass, fail, done (no pass/fail applies) or not finished. */
export type StepVerdict = 'pass' | 'fail' | 'done' | 'incomplete'

export interface RepairStepResult {
  verdict: StepVerdict
  /** One sentence in words: "Held: 2.1 kPa drop after temperature correction, within 15 kPa." */
  summary: string
  figures: StepFigure[]
  warnings: string[]
  /** Cautions of this step for this stage and refrigerant only. */
  cautions: string[]
}

export interface RepairStepRecord {
  /** Position in the case's list of steps; stable, since steps are only appended. */
  index: number
  kind: RepairStepKind
  stage: Stage
  at: string
  by: number | null
  input: RepairStepInput
  result: RepairStepResult
  struck?: Revision
}
