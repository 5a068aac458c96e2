// The column-mapping step of a logger upload as plain data: one row per column of the file, which the
// form edits, turned back into the mapping the server checks (shared/schemas/logger.ts).
import type { LoggerMappingInput } from '#shared/schemas/logger'
import { PRESSURE_READING_UNITS, TEMPERATURE_READING_UNITS, isStageQuantity, type Stage } from '#shared/types/diagnosis'
import { OTHER_QUANTITY, type LoggerQuantity } from '#shared/types/logger'

export type MappedQuantity = LoggerQuantity | typeof OTHER_QUANTITY

/** One column of the file in the form: left out, or mapped to a quantity in a unit. */
export interface ColumnRow {
  column: string
  /** Where the column stands in the file, counting from 0. */
  position: number
  include: boolean
  quantity: MappedQuantity
  stage: Stage
  unit: string
}

export interface MappingForm {
  /** True for a file without a header row: its columns are mapped by position, not by name. */
  byPosition: boolean
  /** The header as the preview read it ("column 1", "column 2" … for a file without one). */
  header: string[]
  delimiter: string
  decimal: string
  timeColumn: string
  timeFormat: string
  utcOffsetMinutes: number
  setpointC: string
  rows: ColumnRow[]
}

/** The measurement units a quantity can be logged in. */
export function unitsForQuantity(q: MappedQuantity): readonly string[] {
  if (q === OTHER_QUANTITY) return [...TEMPERATURE_READING_UNITS, ...PRESSURE_READING_UNITS, 'A', 'bool', 'none']
  if (q === 'compressorRunning') return ['bool']
  if (q === 'compressorCurrent') return ['A']
  if (q === 'suctionPressure' || q === 'dischargePressure') return PRESSURE_READING_UNITS
  return TEMPERATURE_READING_UNITS
}

/** True when the quantity belongs to one stage. */
export function needsStage(q: MappedQuantity): boolean {
  return q !== OTHER_QUANTITY && isStageQuantity(q)
}

/**
 * The form for a file's header, filled from a saved or suggested mapping. `byPosition` is true for a
 * file without a header row (the preview found none, or the mapping says so): the mapping then names
 * columns by their position.
 */
export function mappingForm(header: readonly string[], mapping: LoggerMappingInput | null, defaultStage: Stage, byPosition = mapping?.hasHeader === false): MappingForm {
  const time = mapping?.time.column
  const timeColumn = typeof time === 'string' && header.includes(time) ? time : typeof time === 'number' ? header[time] ?? header[0]! : header[0] ?? ''
  const rows = header.flatMap((column, position): ColumnRow[] => {
    if (!column.trim()) return []
    const m = mapping?.columns.find((c) => c.column === column || c.column === position)
    const quantity = (m?.quantity ?? OTHER_QUANTITY) as MappedQuantity
    return [{ column, position, include: !!m && column !== timeColumn, quantity, stage: m?.stage ?? defaultStage, unit: m?.unit ?? unitsForQuantity(quantity)[0]! }]
  })
  return {
    byPosition, header: [...header],
    delimiter: mapping?.delimiter ?? 'auto', decimal: mapping?.decimal ?? 'auto', timeColumn,
    timeFormat: mapping?.time.format ?? 'auto', utcOffsetMinutes: mapping?.time.utcOffsetMinutes ?? 0,
    setpointC: mapping?.setpointC === undefined ? '' : String(mapping.setpointC), rows,
  }
}

/** The mapping the form describes (the server checks it again). */
export function mappingOf(form: MappingForm, setpointC: number | null): LoggerMappingInput {
  const timePosition = Math.max(0, form.header.indexOf(form.timeColumn))
  return {
    delimiter: form.delimiter as LoggerMappingInput['delimiter'],
    decimal: form.decimal as LoggerMappingInput['decimal'],
    ...(form.byPosition ? { hasHeader: false } : {}),
    time: { column: form.byPosition ? timePosition : form.timeColumn, format: form.timeFormat as NonNullable<LoggerMappingInput['time']['format']>, utcOffsetMinutes: form.utcOffsetMinutes },
    columns: form.rows.filter((r) => r.include && r.column !== form.timeColumn).map((r) => ({
      column: form.byPosition ? r.position : r.column, quantity: r.quantity, unit: r.unit as LoggerMappingInput['columns'][number]['unit'], ...(needsStage(r.quantity) ? { stage: r.stage } : {}),
      ...(r.quantity === OTHER_QUANTITY ? { label: r.column.slice(0, 80) } : {}),
    })),
    ...(setpointC === null ? {} : { setpointC }),
  }
}
