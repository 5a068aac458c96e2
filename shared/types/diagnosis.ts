/**
 * Vocabulary and wire types of `POST /api/diagnosis/rank`.
 *
 * The word lists are `as const` arrays so that one list feeds the TypeScript unions, the zod
 * schemas (strict enums) and the knowledge-base validation; a word added here is accepted
 * everywhere at once, and a word missing here is rejected everywhere.
 */

export const UNIT_KINDS = ['cascade', 'single-stage'] as const
export type UnitKind = (typeof UNIT_KINDS)[number]

export const STAGES = ['high', 'low', 'single'] as const
export type Stage = (typeof STAGES)[number]

/** Quantities that belong to one refrigerant circuit and therefore need a `stage`. */
export const STAGE_QUANTITIES = [
  'suctionPressure',
  'dischargePressure',
  'suctionTemperature',
  'dischargeTemperature',
  'liquidLineTemperature',
  'evaporatorTemperature',
  'compressorCurrent',
  'compressorRunning',
  'standingPressure',
] as const
export type StageQuantity = (typeof STAGE_QUANTITIES)[number]

/** Quantities of the whole unit or its surroundings; they carry no `stage`. */
export const UNIT_WIDE_QUANTITIES = [
  'cabinetTemperature',
  'setpointTemperature',
  'cascadeHxTemperature',
  'ambientTemperature',
  'condenserAirInTemperature',
  'condenserAirOutTemperature',
  'runtime',
] as const
export type UnitWideQuantity = (typeof UNIT_WIDE_QUANTITIES)[number]

export const QUANTITIES = [...STAGE_QUANTITIES, ...UNIT_WIDE_QUANTITIES] as const
export type Quantity = (typeof QUANTITIES)[number]

export const SYMPTOMS = [
  'not-cooling',
  'slow-pulldown',
  'warming-over-days',
  'intermittent-cooling',
  'compressor-short-cycling',
  'compressor-not-starting',
  'compressor-tripping',
  'frost-on-capillary',
  'oil-at-fitting',
  'line-tap-valve-present',
  'recently-serviced',
  'refrigerant-label-mismatch',
  'noisy-compressor',
] as const
export type Symptom = (typeof SYMPTOMS)[number]

export const CAUSES = [
  'refrigerant-leak',
  'overcharge',
  'restriction',
  'moisture-freeze',
  'oil-return-blocked',
  'oil-logging',
  'non-condensables',
  'condenser-airflow',
  'evaporator-airflow',
  'compressor-inefficient',
  'compressor-electrical',
  'wrong-refrigerant',
  'high-heat-load',
  'control-sensor-fault',
  'other',
  // Additions to the contract's list (older words keep their meaning):
  'expansion-valve-underfeeding',
  'expansion-valve-overfeeding',
  'expansion-tank-fault',
  'no-refrigeration-fault',
] as const
export type Cause = (typeof CAUSES)[number]

/** Hypotheses that belong to no single circuit: the catch-all and the healthy state. */
export const STAGELESS_CAUSES = ['other', 'no-refrigeration-fault'] as const satisfies readonly Cause[]
export type StagelessCause = (typeof STAGELESS_CAUSES)[number]

export function isStagelessCause(cause: Cause): cause is StagelessCause {
  return (STAGELESS_CAUSES as readonly string[]).includes(cause)
}

export const TESTS = [
  'standing-pressure-check',
  'leak-search',
  'nitrogen-pressure-test',
  'vacuum-decay-test',
  'restriction-temperature-drop',
  'compressor-current-check',
  'compressor-pumping-test',
  'oil-return-line-check',
  'condenser-inspection',
  'refrigerant-identification',
  'sensor-verification',
  'warm-capillary-test',
  'door-and-load-check',
  // Additions to the contract's list:
  'expansion-valve-check',
  'expansion-tank-check',
] as const
export type TestSlug = (typeof TESTS)[number]

/** Pressure units; a trailing "g" means gauge, anything else is absolute. */
export const PRESSURE_READING_UNITS = ['kPa', 'kPag', 'bar', 'barg', 'psia', 'psig', 'MPa'] as const
export const TEMPERATURE_READING_UNITS = ['C', 'F', 'K'] as const
export const READING_UNITS = [...PRESSURE_READING_UNITS, ...TEMPERATURE_READING_UNITS, 'A', 'min', 'bool'] as const
export type PressureReadingUnit = (typeof PRESSURE_READING_UNITS)[number]
export type TemperatureReadingUnit = (typeof TEMPERATURE_READING_UNITS)[number]
export type ReadingUnit = (typeof READING_UNITS)[number]

/** What kind of value each quantity carries; drives the unit check of a reading. */
export type QuantityDimension = 'pressure' | 'temperature' | 'current' | 'time' | 'bool'

export const QUANTITY_DIMENSION: Readonly<Record<Quantity, QuantityDimension>> = {
  suctionPressure: 'pressure',
  dischargePressure: 'pressure',
  standingPressure: 'pressure',
  suctionTemperature: 'temperature',
  dischargeTemperature: 'temperature',
  liquidLineTemperature: 'temperature',
  evaporatorTemperature: 'temperature',
  compressorCurrent: 'current',
  compressorRunning: 'bool',
  cabinetTemperature: 'temperature',
  setpointTemperature: 'temperature',
  cascadeHxTemperature: 'temperature',
  ambientTemperature: 'temperature',
  condenserAirInTemperature: 'temperature',
  condenserAirOutTemperature: 'temperature',
  runtime: 'time',
}

export const DIMENSION_UNITS: Readonly<Record<QuantityDimension, readonly ReadingUnit[]>> = {
  pressure: PRESSURE_READING_UNITS,
  temperature: TEMPERATURE_READING_UNITS,
  current: ['A'],
  time: ['min'],
  bool: ['bool'],
}

export function isStageQuantity(q: Quantity): q is StageQuantity {
  return (STAGE_QUANTITIES as readonly string[]).includes(q)
}

export interface StageConfig {
  stage: Stage
  refrigerant: string
  chargeG?: number
  volumeL?: number
  referenceStandingPressureKpa?: number
  referenceAmbientC?: number
  /** Rated (nameplate RLA) compressor current; lets current readings be judged as % of rated. */
  ratedCurrentA?: number
  /** How the stage meters liquid into its evaporator; expansion-valve causes need a valve. */
  meteringDevice?: MeteringDevice
}

export const METERING_DEVICES = ['capillary', 'expansion-valve'] as const
export type MeteringDevice = (typeof METERING_DEVICES)[number]

export interface UnitDesign {
  cabinetC?: number
  cascadeHxC?: number
}

export interface UnitConfig {
  kind: UnitKind
  stages: StageConfig[]
  design?: UnitDesign
}

/**
 * Where in the job an observation was made. Diagnosis runs until a cause is confirmed or a repair
 * starts; what is measured while repairing (a nitrogen hold, a vacuum decay) or afterwards
 * (verification) is recorded and reported but never moves the ranking.
 */
export const CASE_PHASES = ['diagnosis', 'repair', 'verification'] as const
export type CasePhase = (typeof CASE_PHASES)[number]

export interface Reading {
  quantity: Quantity
  stage?: Stage
  value: number | boolean
  unit: ReadingUnit
  /** Absent means diagnosis. */
  phase?: CasePhase
}

export interface TestResult {
  test: TestSlug
  stage?: Stage
  outcome: string
  /** Absent means diagnosis. */
  phase?: CasePhase
}

/** Where the unit stands: sets the atmospheric pressure used to turn gauge readings into absolute. */
export interface SiteConfig {
  altitudeM?: number
  atmosphericKpa?: number
}

export interface RankRequest {
  unit: UnitConfig
  site?: SiteConfig
  symptoms?: Symptom[]
  readings?: Reading[]
  testResults?: TestResult[]
}

export interface EvidenceItem {
  rule: string
  text: string
  /** How many times as likely this cause is made by the item, against the field of causes (below 1: against it). */
  factor?: number
}

export interface RankedCause {
  cause: Cause
  /** Absent only for `other` and `no-refrigeration-fault`, which are not tied to one circuit. */
  stage?: Stage
  probability: number
  title: string
  prior: number
  evidence: EvidenceItem[]
  evidenceAgainst: EvidenceItem[]
}

export interface HypothesisRef {
  cause: Cause
  stage?: Stage
}

export interface ProposedTest {
  test: TestSlug
  stage: Stage
  /**
   * Expected information gain over the current cause×stage distribution (bits). Kept for scripts
   * that sort or compare proposals; people read `value` instead.
   */
  expectedGain: number
  /** What the test would settle, in words ("Settles leak against blockage on the low stage."). */
  value: string
  minutes: number
  title: string
  /** Gain per minute of cost (time, plus a surcharge for opening the system or hot work); the sort key. */
  score: number
  opensSystem: boolean
  hotWork: boolean
  safetyNotes: string[]
  separates: HypothesisRef[]
}

export interface StageDerived {
  saturatedSuctionC?: number
  saturatedCondensingC?: number
  superheatK?: number
  subcoolingK?: number
  compressionRatio?: number
  dischargeSuperheatK?: number
  expectedStandingPressureKpa?: number
  standingPercentOfExpected?: number
  standingChargePercent?: number
  standingPhase?: 'gas' | 'two-phase' | 'liquid' | 'supercritical'
  currentPercentOfRated?: number
  refrigerantFitK?: number
  bestFitRefrigerant?: string
  /** Refrigerant the derived values were worked out with: the nameplate one, or the best fit when the readings fit another. */
  workingRefrigerant?: string
  /** Whether the compressor was running when the readings were taken (reported or inferred). */
  running?: boolean
}

export interface MissingReading {
  quantity: Quantity
  stage?: Stage
  /** How many rules of the knowledge base are waiting for this reading. */
  rulesWaiting: number
}

export interface RankResponse {
  causes: RankedCause[]
  tests: ProposedTest[]
  derived: Partial<Record<Stage, StageDerived>>
  warnings: string[]
  priorNote: string
  /** Readings and test results kept in the record but left out of the ranking, in words (repair and verification phases). */
  setAside: string[]
  missingReadings: MissingReading[]
  knowledgeBaseVersion: { id: string | number; label: string; status: 'draft' | 'published' }
}

/** The knowledge base's track record on closed cases (`GET /api/diagnosis/agreement`). */
export interface RankingAgreement {
  closedCases: number
  topMatches: number
  topThreeMatches: number
  topShare: number | null
  topThreeShare: number | null
}
