// Measurement units (psig, °C, A …) as people read them. In code a "unit" is the machine on the
// register; the thing a number is measured in is a "measurement unit" and lives here.
import type { ReadingUnit, TemperatureReadingUnit } from '#shared/types/diagnosis'
import { PRESSURE_UNIT_LABELS, type AnyPressureUnit } from '#shared/utils/properties'
import type { WordForm, WordLabel } from './words'

/** A measurement unit: `short` is the symbol beside a figure, `long` names it in pickers. */
export interface MeasurementUnitWord extends WordLabel {
  /** Decimals a figure in this unit is shown with by default. */
  decimals: number
}

/** Pressure units (gauge, absolute and vacuum): the symbol says absolute, gauge or vacuum in every case. One table, kept with the conversions. */
export const PRESSURE_UNIT_WORDS: Readonly<Record<AnyPressureUnit, MeasurementUnitWord & { gauge: boolean }>> = PRESSURE_UNIT_LABELS

/** Temperature units as shown beside figures and in pickers. */
export const TEMPERATURE_UNIT_WORDS: Readonly<Record<TemperatureReadingUnit, MeasurementUnitWord>> = {
  C: { short: '°C', long: '°C', decimals: 1 },
  F: { short: '°F', long: '°F', decimals: 1 },
  K: { short: 'K', long: 'kelvin (K)', decimals: 2 },
}

/** Every measurement unit a reading may carry. */
export const MEASUREMENT_UNIT_WORDS: Readonly<Record<ReadingUnit | AnyPressureUnit, MeasurementUnitWord>> = {
  ...PRESSURE_UNIT_WORDS,
  ...TEMPERATURE_UNIT_WORDS,
  A: { short: 'A', long: 'ampere (A)', decimals: 1 },
  min: { short: 'min', long: 'minutes', decimals: 0 },
  bool: { short: '', long: 'yes / no', decimals: 0 },
}

/** The symbol shown beside a figure ("psig", "°C"); a unit without an entry (g, L, %) is its own symbol. */
export function measurementSymbol(unit: string): string {
  return (MEASUREMENT_UNIT_WORDS as Readonly<Record<string, MeasurementUnitWord>>)[unit]?.short ?? unit
}

/** A measurement unit in words for a picker ("psi gauge (psig)"), or its symbol in the short form. */
export function measurementUnitLabel(unit: string, form: WordForm = 'long'): string {
  return (MEASUREMENT_UNIT_WORDS as Readonly<Record<string, MeasurementUnitWord>>)[unit]?.[form] ?? unit
}

/** True for gauge pressure units (kPag, barg, psig): they read against the local atmosphere. */
export function isGaugeUnit(unit: string): boolean {
  return (PRESSURE_UNIT_WORDS as Readonly<Record<string, { gauge: boolean }>>)[unit]?.gauge ?? false
}
