// Figures as people read them: a true minus sign, a fixed number of decimals, the measurement unit
// always beside the number. Pages keep a figure and its unit on one line with whitespace-nowrap.
import type { Reading } from '#shared/types/diagnosis'
import { MEASUREMENT_UNIT_WORDS, measurementSymbol } from '../vocabulary/measurement-units'

/** Shown where a figure is not known. */
export const NO_FIGURE = '—'

/** "−80.0": fixed decimals with a true minus sign, never "−0.0". */
export function formatFigure(value: number, decimals: number): string {
  const text = value.toFixed(decimals)
  if (Number(text) === 0) return (0).toFixed(decimals)
  return text.replace('-', '\u2212')
}

/** Decimals that show a value as it was typed: none for whole numbers, up to `max` otherwise. */
export function naturalDecimals(value: number, max = 2): number {
  if (Number.isInteger(value)) return 0
  const [, fraction = ''] = String(value).split('.')
  return Math.min(fraction.replace(/e.*$/, '').length, max)
}

/**
 * A figure with its measurement unit: "−80.0 °C", "12 psig", "7.5 L"; "—" when unknown. Without
 * `decimals` the unit's usual precision is used, or the value's own for units without one (g, L).
 */
export function formatQuantity(value: number | null | undefined, unit: string, decimals?: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NO_FIGURE
  const known = (MEASUREMENT_UNIT_WORDS as Readonly<Record<string, { decimals: number }>>)[unit]
  const places = decimals ?? (known ? known.decimals : naturalDecimals(value))
  const symbol = measurementSymbol(unit)
  return symbol ? `${formatFigure(value, places)} ${symbol}` : formatFigure(value, places)
}

/** A reading exactly as it was entered, with its unit: "12 psig", "−80.5 °C", "yes". */
export function formatReading(reading: Pick<Reading, 'value' | 'unit'>): string {
  if (typeof reading.value === 'boolean') return reading.value ? 'yes' : 'no'
  return formatQuantity(reading.value, reading.unit, naturalDecimals(reading.value, 3))
}

/** "71 %": a fraction from 0 to 1 as a whole percentage. */
export function formatPercent(fraction: number): string {
  return `${Math.round(fraction * 100)} %`
}

/** "1 site", "3 sites": a count with its noun in the right number. */
export function formatCount(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${n === 1 ? singular : plural}`
}
