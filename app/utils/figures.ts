/**
 * Reading and writing figures in the calculator. Numbers typed on a phone may use a decimal comma, a
 * typographic minus or spaces between thousands; figures shown always carry their unit, and pressures
 * always say whether they are absolute or gauge.
 */
import { PRESSURE_UNIT_LABELS, type AnyPressureUnit, type TemperatureUnit } from '#shared/utils/properties'

export type ParsedDecimal = { state: 'empty' } | { state: 'ok'; value: number } | { state: 'invalid'; message: string }

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i

/** Reads a typed number; never yields NaN or Infinity. */
export function parseDecimal(text: string): ParsedDecimal {
  let s = text.trim().replace(/[\s\u00a0\u202f]/g, '').replace(/\u2212/g, '-')
  // A lone sign is a number being typed, not a mistake yet.
  if (s === '' || s === '-' || s === '+') return { state: 'empty' }
  // One comma and no point is a decimal comma (e.g. "1,5"); anything else with commas is ambiguous.
  if (!s.includes('.') && (s.match(/,/g) ?? []).length === 1) s = s.replace(',', '.')
  const value = Number(s)
  if (!DECIMAL.test(s) || !Number.isFinite(value)) return { state: 'invalid', message: 'Type a number, for example −80 or 1.5' }
  return { state: 'ok', value }
}

/** Fixed decimals with a true minus sign, and no "−0.0". */
export function formatFigure(value: number, decimals: number): string {
  const text = value.toFixed(decimals)
  if (Number(text) === 0) return (0).toFixed(decimals)
  return text.replace('-', '\u2212')
}

export interface UnitLabel {
  /** Shown beside every figure. */
  short: string
  /** Shown in unit pickers. */
  long: string
  decimals: number
}

/** Pressure units (gauge, absolute and vacuum): the short label says absolute, gauge or vacuum in every case. */
export const PRESSURE_LABELS: Readonly<Record<AnyPressureUnit, UnitLabel & { gauge: boolean }>> = PRESSURE_UNIT_LABELS

/** Temperature units as shown beside figures and in pickers. */
export const TEMPERATURE_LABELS: Record<TemperatureUnit, UnitLabel> = {
  C: { short: '°C', long: '°C', decimals: 1 },
  F: { short: '°F', long: '°F', decimals: 1 },
  K: { short: 'K', long: 'kelvin (K)', decimals: 2 },
}
