/** Strict unit conversions. Pressures are converted to absolute kPa, temperatures to °C. */
import { OutOfRangeError, UnitError } from './errors'

export const PRESSURE_UNITS = ['kPa', 'kPag', 'bar', 'barg', 'psia', 'psig', 'MPa'] as const
export const TEMPERATURE_UNITS = ['C', 'F', 'K'] as const
export type PressureUnit = (typeof PRESSURE_UNITS)[number]
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number]

/** Standard atmosphere, kPa. */
export const STANDARD_ATMOSPHERE_KPA = 101.325
/** 1 psi in kPa (exact by definition of the pound-force and inch). */
export const KPA_PER_PSI = 6.894757293168361

const isPressureUnit = (u: string): u is PressureUnit => (PRESSURE_UNITS as readonly string[]).includes(u)
const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)

function finite(value: number, what: string, allowed: readonly string[]): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new UnitError(`${what} must be a finite number, got ${String(value)}.`, allowed)
}

/** Convert a pressure reading to absolute kPa; gauge units add the local atmospheric pressure (default 101.325 kPa). */
export function toKpaAbs(value: number, unit: string, atmosphericKpa: number = STANDARD_ATMOSPHERE_KPA): number {
  if (!isPressureUnit(unit)) throw new UnitError(`Unknown pressure unit "${unit}". Use one of: ${PRESSURE_UNITS.join(', ')}.`, PRESSURE_UNITS)
  finite(value, 'Pressure', PRESSURE_UNITS)
  finite(atmosphericKpa, 'Atmospheric pressure', PRESSURE_UNITS)
  const abs = {
    kPa: value,
    kPag: value + atmosphericKpa,
    bar: value * 100,
    barg: value * 100 + atmosphericKpa,
    psia: value * KPA_PER_PSI,
    psig: value * KPA_PER_PSI + atmosphericKpa,
    MPa: value * 1000,
  }[unit]
  // A gauge reading below −1 atm (or a negative absolute one) is not physical: likely a sign or unit slip.
  if (abs < 0) throw new OutOfRangeError(`${value} ${unit} is below a perfect vacuum (0 kPa absolute); check the sign and the unit.`, { minC: -273.15, maxC: Infinity, minKpa: 0 })
  return abs
}

/** Convert absolute kPa to the given unit (gauge units subtract the atmospheric pressure). */
export function fromKpaAbs(kpa: number, unit: PressureUnit, atmosphericKpa: number = STANDARD_ATMOSPHERE_KPA): number {
  if (!isPressureUnit(unit)) throw new UnitError(`Unknown pressure unit "${String(unit)}".`, PRESSURE_UNITS)
  finite(kpa, 'Pressure', PRESSURE_UNITS)
  finite(atmosphericKpa, 'Atmospheric pressure', PRESSURE_UNITS)
  return {
    kPa: kpa,
    kPag: kpa - atmosphericKpa,
    bar: kpa / 100,
    barg: (kpa - atmosphericKpa) / 100,
    psia: kpa / KPA_PER_PSI,
    psig: (kpa - atmosphericKpa) / KPA_PER_PSI,
    MPa: kpa / 1000,
  }[unit]
}

/** Convert a temperature to °C; throws UnitError on an unknown unit, OutOfRangeError below absolute zero. */
export function toCelsius(value: number, unit: string): number {
  if (!isTemperatureUnit(unit)) throw new UnitError(`Unknown temperature unit "${unit}". Use one of: ${TEMPERATURE_UNITS.join(', ')}.`, TEMPERATURE_UNITS)
  finite(value, 'Temperature', TEMPERATURE_UNITS)
  const c = unit === 'C' ? value : unit === 'F' ? ((value - 32) * 5) / 9 : value - 273.15
  if (c < -273.15) throw new OutOfRangeError(`${value} ${unit} is below absolute zero.`, { minC: -273.15, maxC: Infinity })
  return c
}

/** Convert °C to the given unit. */
export function fromCelsius(c: number, unit: TemperatureUnit): number {
  if (!isTemperatureUnit(unit)) throw new UnitError(`Unknown temperature unit "${String(unit)}".`, TEMPERATURE_UNITS)
  finite(c, 'Temperature', TEMPERATURE_UNITS)
  return unit === 'C' ? c : unit === 'F' ? (c * 9) / 5 + 32 : c + 273.15
}

/** ISO 2533 standard-atmosphere pressure (kPa) at an altitude in metres (troposphere, −500 … 11 000 m). */
export function atmosphericPressureAtAltitude(altitudeM: number): number {
  if (typeof altitudeM !== 'number' || !Number.isFinite(altitudeM)) throw new UnitError(`Altitude must be a finite number of metres, got ${String(altitudeM)}.`, ['m'])
  if (altitudeM < -500 || altitudeM > 11000) throw new OutOfRangeError(`The standard-atmosphere formula covers −500 m to 11 000 m; got ${altitudeM} m.`)
  return STANDARD_ATMOSPHERE_KPA * Math.pow(1 - 2.25577e-5 * altitudeM, 5.25588)
}
