/**
 * Data-logger CSV analysis: what a column can hold, and the summary the analysis returns (chart series,
 * pull-downs, stalls, and the readings and symptoms it offers to a case). The column-mapping schema is in
 * shared/schemas/logger.ts; the analysis itself in server/domain/logger.
 */
import { QUANTITIES, type Quantity, type ReadingUnit, type Stage, type Symptom } from './diagnosis'

/** Quantities a logger column can carry: the case vocabulary, minus those a logger cannot record. */
const NOT_LOGGED = ['runtime', 'standingPressure'] as const
export type LoggerQuantity = Exclude<Quantity, (typeof NOT_LOGGED)[number]>
// Typed as a non-empty tuple because zod's enum needs one; the filter leaves all but two words.
export const LOGGER_QUANTITIES = QUANTITIES.filter((q): q is LoggerQuantity => !(NOT_LOGGED as readonly string[]).includes(q)) as unknown as readonly [
  LoggerQuantity,
  ...LoggerQuantity[],
]

/** A column the analysis keeps for the chart but does not interpret. */
export const OTHER_QUANTITY = 'other'

/** How the time column is written. `auto` looks at the first rows. */
export const TIME_FORMATS = [
  'auto',
  'iso',
  'day-month-year',
  'month-day-year',
  'epoch-s',
  'epoch-ms',
  'excel-serial',
  'elapsed-s',
  'elapsed-min',
  'elapsed-h',
] as const
export type TimeFormat = (typeof TIME_FORMATS)[number]

export const CSV_DELIMITERS = ['auto', ',', ';', '\t', '|'] as const
export const DECIMAL_MARKS = ['auto', '.', ','] as const

export interface LoggerRowError {
  /** Record number in the file, counting from 1 at the first line (header and preamble included). */
  row: number
  /** Column name from the header (or "column N" without one); null for a whole-row problem. */
  column: string | null
  message: string
}

export interface SeriesPoint {
  /** Bucket start, ms since 1970 (or since the log start for elapsed-time logs). */
  t: number
  min: number
  max: number
  mean: number
}

export interface LoggerSeries {
  column: string
  quantity: LoggerQuantity | typeof OTHER_QUANTITY
  stage: Stage | null
  label: string
  /** Unit after conversion: temperatures °C, pressures kPa absolute, current A, running 0/1. */
  unit: 'C' | 'kPa' | 'A' | 'bool' | string
  count: number
  missing: number
  min: number | null
  max: number | null
  mean: number | null
  last: number | null
  lastAt: number | null
  points: SeriesPoint[]
}

export interface PullDown {
  startAt: number
  startC: number
  reached: boolean
  reachedAt: number | null
  minutesToSetpoint: number | null
  endAt: number
  endC: number
  averageRateKPerHour: number
  initialRateKPerHour: number | null
  finalRateKPerHour: number | null
}

export interface Stall {
  startAt: number
  endAt: number
  minutes: number
  levelC: number
  aboveSetpointK: number
  /** true: the compressor ran; null: no compressor column, so running was assumed. */
  running: boolean | null
  cascadeHxC: number | null
  ambientC: number | null
}

export interface WarmUp {
  startAt: number
  peakAt: number
  peakC: number
  endAt: number | null
  minutes: number
  compressorOff: boolean | null
}

export interface OfferedReading {
  quantity: Quantity
  stage?: Stage
  value: number | boolean
  unit: ReadingUnit
  at: number | null
  note: string
}

export interface OfferedSymptom {
  symptom: Symptom
  evidence: string
}

export interface LoggerAnalysis {
  status: 'ok' | 'ok-with-errors' | 'failed'
  /** Why the file could not be analysed, when status is failed. */
  failure: string | null
  rows: { total: number; data: number; valid: number; withErrors: number; empty: number }
  errors: LoggerRowError[]
  warnings: string[]
  format: { encoding: string; delimiter: string; decimal: string; headerRow: number | null; timeFormat: TimeFormat; columns: string[] }
  /** Times are absolute (ms since 1970) unless the log only has elapsed time; then ms since its start. */
  timeBase: 'absolute' | 'elapsed'
  span: { startAt: number; endAt: number; minutes: number; typicalIntervalSeconds: number | null; gaps: number; longestGapMinutes: number } | null
  chartBucketSeconds: number
  analysisResolutionSeconds: number
  series: LoggerSeries[]
  setpointC: number | null
  setpointSource: 'mapping' | 'column' | 'unit' | null
  pullDowns: PullDown[]
  stalls: Stall[]
  warmUps: WarmUp[]
  compressor: { starts: number; shortCycles: number; runFraction: number; hours: number } | null
  offered: { readings: OfferedReading[]; symptoms: OfferedSymptom[] }
}
