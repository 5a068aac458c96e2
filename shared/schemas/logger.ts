/**
 * The column mapping of a data-logger CSV: which column is the time and how it is written, which
 * columns hold which quantity in which unit. The mapping step of the upload page checks it with this
 * schema; a mapping is remembered per logger model, so it must be self-contained.
 */
import { z } from 'zod'
import { PRESSURE_READING_UNITS, STAGES, TEMPERATURE_READING_UNITS, isStageQuantity } from '#shared/types/diagnosis'
import { CSV_DELIMITERS, DECIMAL_MARKS, LOGGER_QUANTITIES, OTHER_QUANTITY, TIME_FORMATS, type LoggerQuantity } from '#shared/types/logger'

const words = <const T extends readonly [string, ...string[]]>(label: string, list: T) =>
  z.enum(list, { error: (i) => (i.input === undefined ? `Give the ${label}: ${list.join(', ')}` : `Unknown ${label} ${JSON.stringify(i.input)}; allowed: ${list.join(', ')}`) })

/** A column by its header text, or by its position counting from 0 when the file has no header. */
export const ColumnRefSchema = z.union([
  z.string().trim().min(1, 'Name the column as the header writes it').max(200),
  z.number().int('A column position is a whole number').min(0, 'Column positions count from 0').max(999),
])
export type ColumnRef = z.infer<typeof ColumnRefSchema>

const QUANTITY_WORDS = [...LOGGER_QUANTITIES, OTHER_QUANTITY] as const
const UNIT_WORDS = [...TEMPERATURE_READING_UNITS, ...PRESSURE_READING_UNITS, 'A', 'bool', 'none'] as const

function unitsFor(q: LoggerQuantity | typeof OTHER_QUANTITY): readonly string[] {
  if (q === OTHER_QUANTITY) return UNIT_WORDS
  if (q === 'compressorRunning') return ['bool']
  if (q === 'compressorCurrent') return ['A']
  if (q === 'suctionPressure' || q === 'dischargePressure') return PRESSURE_READING_UNITS
  return TEMPERATURE_READING_UNITS
}

/** One mapped column: where it is, what quantity it holds, in which unit (and for which stage). */
export const LoggerColumnSchema = z
  .object({
    column: ColumnRefSchema,
    quantity: words('quantity', QUANTITY_WORDS),
    stage: words('stage', STAGES).optional(),
    unit: words('unit', UNIT_WORDS),
    label: z.string().trim().max(80).optional(),
  })
  .strict()
  .superRefine((c, ctx) => {
    const allowed = unitsFor(c.quantity)
    if (!allowed.includes(c.unit)) ctx.addIssue({ code: 'custom', path: ['unit'], message: `Unit "${c.unit}" does not fit ${c.quantity}; allowed: ${allowed.join(', ')}` })
    if (c.quantity !== OTHER_QUANTITY && isStageQuantity(c.quantity) && c.stage === undefined) {
      ctx.addIssue({ code: 'custom', path: ['stage'], message: `${c.quantity} belongs to one stage; give "stage" (${STAGES.join(', ')})` })
    }
  })
export type LoggerColumn = z.infer<typeof LoggerColumnSchema>

/** Thresholds of the pull-down analysis; every one has a default suited to lab freezers. */
export const LoggerAnalysisSettingsSchema = z
  .object({
    /** Within this many K above the setpoint the cabinet counts as at setpoint (default 3 K). */
    setpointToleranceK: z.number().positive().max(20).optional(),
    /** A plateau is at most this wide, K (default 1.5 K). */
    stallBandK: z.number().positive().max(10).optional(),
    /** A plateau lasts at least this long, minutes (default 45 min). */
    stallMinMinutes: z.number().positive().max(24 * 60).optional(),
    /** Expected hours from the start of a pull-down to setpoint; slower is offered as slow-pulldown. */
    expectedPullDownHours: z.number().positive().max(96).optional(),
  })
  .strict()

/** A whole column mapping, as the upload's mapping step saves it per logger model. */
export const LoggerMappingSchema = z
  .object({
    delimiter: words('delimiter', CSV_DELIMITERS).default('auto'),
    decimal: words('decimal mark', DECIMAL_MARKS).default('auto'),
    /** Line number (from 1) of the header; omitted: found by looking for the mapped column names. */
    headerRow: z.number().int().min(1).max(1000).optional(),
    hasHeader: z.boolean().default(true),
    time: z
      .object({
        column: ColumnRefSchema,
        /** A separate time-of-day column, when the logger writes date and time apart. */
        timeOfDayColumn: ColumnRefSchema.optional(),
        format: words('time format', TIME_FORMATS).default('auto'),
        /** Offset of the logger's clock from UTC, minutes (e.g. 60 for UTC+1); ignored when times carry a zone. */
        utcOffsetMinutes: z.number().int().min(-14 * 60).max(14 * 60).default(0),
        /** For elapsed-time logs: when the log started (ISO 8601), so readings get a date. */
        startedAt: z.iso.datetime({ offset: true }).optional(),
      })
      .strict(),
    columns: z.array(LoggerColumnSchema).min(1, 'Map at least one column').max(64, 'Map at most 64 columns'),
    /** The controller setpoint, °C, when no column records it. */
    setpointC: z.number().min(-150).max(60).optional(),
    analysis: LoggerAnalysisSettingsSchema.optional(),
  })
  .strict()
  .superRefine((m, ctx) => {
    const seen = new Set<string>()
    m.columns.forEach((c, i) => {
      const key = `${c.quantity}|${c.stage ?? ''}`
      if (c.quantity !== OTHER_QUANTITY && seen.has(key)) ctx.addIssue({ code: 'custom', path: ['columns', i, 'quantity'], message: `${c.quantity}${c.stage ? ` (${c.stage})` : ''} is mapped twice` })
      seen.add(key)
    })
    const refs = [m.time.column, ...(m.time.timeOfDayColumn !== undefined ? [m.time.timeOfDayColumn] : []), ...m.columns.map((c) => c.column)]
    if (!m.hasHeader && refs.some((r) => typeof r === 'string')) {
      ctx.addIssue({ code: 'custom', path: ['hasHeader'], message: 'Without a header, name columns by position (0, 1, 2 …)' })
    }
  })
export type LoggerMapping = z.output<typeof LoggerMappingSchema>
export type LoggerMappingInput = z.input<typeof LoggerMappingSchema>
