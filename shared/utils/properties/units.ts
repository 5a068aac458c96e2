/**
 * Strict unit conversions. Pressures are converted to absolute kPa, temperatures to °C.
 * Gauge units (kPag, barg, psig) and inches of mercury vacuum (inHgV) are read against the local
 * atmosphere the caller passes (standard sea-level atmosphere unless told); the vacuum units serve
 * evacuation (micron gauges read absolute).
 */
import { OutOfRangeError, UnitError } from './errors'

export const PRESSURE_UNITS = ['kPa', 'kPag', 'bar', 'barg', 'psia', 'psig', 'MPa'] as const
/** Units of evacuation: microns of mercury (µmHg, absolute), millibar and pascal (absolute), inches of mercury vacuum (below the local atmosphere). */
export const VACUUM_UNITS = ['micron', 'mbar', 'Pa', 'inHgV'] as const
/** Every pressure unit the conversions accept. */
export const ALL_PRESSURE_UNITS = [...PRESSURE_UNITS, ...VACUUM_UNITS] as const
export const TEMPERATURE_UNITS = ['C', 'F', 'K'] as const
export type PressureUnit = (typeof PRESSURE_UNITS)[number]
export type VacuumUnit = (typeof VACUUM_UNITS)[number]
export type AnyPressureUnit = (typeof ALL_PRESSURE_UNITS)[number]
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number]

/** Standard atmosphere, kPa. */
export const STANDARD_ATMOSPHERE_KPA = 101.325
/** 1 psi in kPa (exact by definition of the pound-force and inch). */
export const KPA_PER_PSI = 6.894757293168361
/** 1 mmHg (conventional: 13.5951 g/cm³ mercury under standard gravity) in kPa; a micron is a thousandth of it. */
export const KPA_PER_MMHG = 0.133322387415
/** 1 inHg (conventional) = 25.4 mmHg, in kPa. */
export const KPA_PER_INHG = 25.4 * KPA_PER_MMHG

/** How a pressure unit is shown: the short label always says absolute or gauge; decimals suit the unit's size. */
export interface PressureUnitLabel { short: string; long: string; decimals: number; gauge: boolean }

/** Labels of every pressure unit, shared by the app and the server's texts so they never drift apart. */
export const PRESSURE_UNIT_LABELS: Readonly<Record<AnyPressureUnit, PressureUnitLabel>> = {
  kPa: { short: 'kPa abs', long: 'kPa absolute', decimals: 1, gauge: false },
  kPag: { short: 'kPag', long: 'kPa gauge (kPag)', decimals: 1, gauge: true },
  bar: { short: 'bar abs', long: 'bar absolute', decimals: 3, gauge: false },
  barg: { short: 'bar g', long: 'bar gauge (barg)', decimals: 3, gauge: true },
  psia: { short: 'psia', long: 'psi absolute (psia)', decimals: 1, gauge: false },
  psig: { short: 'psig', long: 'psi gauge (psig)', decimals: 1, gauge: true },
  MPa: { short: 'MPa abs', long: 'MPa absolute', decimals: 4, gauge: false },
  micron: { short: 'micron abs', long: 'micron (µmHg, absolute)', decimals: 0, gauge: false },
  mbar: { short: 'mbar abs', long: 'millibar absolute (mbar)', decimals: 1, gauge: false },
  Pa: { short: 'Pa abs', long: 'pascal absolute (Pa)', decimals: 0, gauge: false },
  inHgV: { short: 'inHg vac', long: 'inches of mercury vacuum (inHg vac)', decimals: 2, gauge: true },
}

/** Units read against the local atmosphere rather than against a perfect vacuum. */
const GAUGE_UNITS: ReadonlySet<string> = new Set(ALL_PRESSURE_UNITS.filter((u) => PRESSURE_UNIT_LABELS[u].gauge))

/** True if `u` is one of the accepted pressure units (gauge, absolute or vacuum). */
export const isPressureUnit = (u: string): u is AnyPressureUnit => (ALL_PRESSURE_UNITS as readonly string[]).includes(u)
const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)
/** True if readings in `u` are relative to the local atmosphere. */
export const isGaugeUnit = (u: string): boolean => GAUGE_UNITS.has(u)

function finite(value: number, what: string, allowed: readonly string[]): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new UnitError(`${what} must be a finite number, got ${String(value)}.`, allowed)
}

/** Convert a pressure reading to absolute kPa; gauge units add the local atmospheric pressure (default 101.325 kPa). */
export function toKpaAbs(value: number, unit: string, atmosphericKpa: number = STANDARD_ATMOSPHERE_KPA): number {
  if (!isPressureUnit(unit)) throw new UnitError(`Unknown pressure unit "${unit}". Use one of: ${ALL_PRESSURE_UNITS.join(', ')}.`, ALL_PRESSURE_UNITS)
  finite(value, 'Pressure', ALL_PRESSURE_UNITS)
  finite(atmosphericKpa, 'Atmospheric pressure', ALL_PRESSURE_UNITS)
  // A vacuum gauge counts down from the atmosphere: a negative reading would be a pressure above it.
  if (unit === 'inHgV' && value < 0) throw new OutOfRangeError(`${value} inHg vacuum is above atmospheric pressure; read such pressures in psig or kPag.`, { minC: -273.15, maxC: Infinity, minKpa: 0, maxKpa: atmosphericKpa })
  const abs = {
    kPa: value,
    kPag: value + atmosphericKpa,
    bar: value * 100,
    barg: value * 100 + atmosphericKpa,
    psia: value * KPA_PER_PSI,
    psig: value * KPA_PER_PSI + atmosphericKpa,
    MPa: value * 1000,
    micron: value * KPA_PER_MMHG * 1e-3,
    mbar: value / 10,
    Pa: value / 1000,
    inHgV: atmosphericKpa - value * KPA_PER_INHG,
  }[unit]
  if (!Number.isFinite(abs)) throw new OutOfRangeError(`${value} ${unit} is too large to be a pressure; check the unit.`, { minC: -273.15, maxC: Infinity, minKpa: 0 })
  // A gauge reading below −1 atm (or a negative absolute one) is not physical: likely a sign or unit slip.
  if (abs < 0) throw new OutOfRangeError(`${value} ${unit} is below a perfect vacuum (0 kPa absolute); check the sign and the unit.`, { minC: -273.15, maxC: Infinity, minKpa: 0 })
  return abs
}

/** Convert absolute kPa to the given unit (gauge units subtract the atmospheric pressure; inHgV counts down from it). */
export function fromKpaAbs(kpa: number, unit: AnyPressureUnit, atmosphericKpa: number = STANDARD_ATMOSPHERE_KPA): number {
  if (!isPressureUnit(unit)) throw new UnitError(`Unknown pressure unit "${String(unit)}".`, ALL_PRESSURE_UNITS)
  finite(kpa, 'Pressure', ALL_PRESSURE_UNITS)
  finite(atmosphericKpa, 'Atmospheric pressure', ALL_PRESSURE_UNITS)
  return {
    kPa: kpa,
    kPag: kpa - atmosphericKpa,
    bar: kpa / 100,
    barg: (kpa - atmosphericKpa) / 100,
    psia: kpa / KPA_PER_PSI,
    psig: (kpa - atmosphericKpa) / KPA_PER_PSI,
    MPa: kpa / 1000,
    micron: kpa / (KPA_PER_MMHG * 1e-3),
    mbar: kpa * 10,
    Pa: kpa * 1000,
    inHgV: (atmosphericKpa - kpa) / KPA_PER_INHG,
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
