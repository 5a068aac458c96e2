/**
 * Reading normalisation: every reading to trade units (kPa absolute, °C, A, min) with a standard
 * uncertainty, phase filtering (repair and verification readings are kept out of the diagnosis),
 * and the plain-words warnings for readings that cannot be used.
 *
 * The uncertainty combines the resolution the technician typed (a value entered as "15 psig" is known
 * to ±0.5 psi: a uniform error of one step has σ = step/√12) with the instrument's own accuracy
 * (service gauges about ±1 % of the reading, pipe-clamp and air probes about ±0.5 K, clamp meters
 * about ±3 %: common practice, no source).
 */
import * as props from '#shared/utils/properties'
import { QUANTITY_DIMENSION, type PressureReadingUnit, type Quantity, type RankRequest, type Reading, type Stage, type TemperatureReadingUnit } from '#shared/types/diagnosis'
import { readingName, type FactSheet } from './fact-sheet'

export interface NormalisedReading {
  value: number | boolean
  /** Standard uncertainty in the normalised unit (kPa, K, A, min); 0 for booleans. */
  sigma: number
}

export interface NormalisedReadings {
  /** Keyed `quantity` or `stage:quantity`. */
  values: Map<string, NormalisedReading>
  atmosphericKpa: number
  /** Readings kept in the record but left out of the diagnosis, in words. */
  setAside: string[]
}

const KPA_PER_PSI = 6.894757293168361
const KPA_PER_UNIT: Record<PressureReadingUnit, number> = { kPa: 1, kPag: 1, bar: 100, barg: 100, psia: KPA_PER_PSI, psig: KPA_PER_PSI, MPa: 1000 }
const KELVIN_PER_UNIT: Record<TemperatureReadingUnit, number> = { C: 1, K: 1, F: 5 / 9 }
/** Instrument accuracy (1σ): service gauge ±1 % of reading with a 1 kPa floor, temperature probe 0.5 K, clamp meter 3 % (common practice, no source). */
const GAUGE_RELATIVE = 0.01
const GAUGE_FLOOR_KPA = 1
const PROBE_K = 0.5
const CLAMP_RELATIVE = 0.03

export function readingKey(r: Pick<Reading, 'quantity' | 'stage'>): string {
  return r.stage ? `${r.stage}:${r.quantity}` : r.quantity
}

/** Step of the last digit typed: 15 → 1, 1.25 → 0.01. */
export function typedStep(value: number): number {
  const text = String(value)
  if (text.includes('e')) return Math.abs(value) * 1e-3 || 1
  const dot = text.indexOf('.')
  return dot < 0 ? 1 : 10 ** -(text.length - dot - 1)
}

const quadrature = (...xs: number[]) => Math.sqrt(xs.reduce((a, x) => a + x * x, 0))

function normalise(r: Reading, atmosphericKpa: number, sheet: FactSheet): NormalisedReading | undefined {
  const value = r.value
  const name = readingName(r.quantity, r.stage)
  if (typeof value === 'boolean') return { value, sigma: 0 }
  const dim = QUANTITY_DIMENSION[r.quantity]
  const step = typedStep(value)
  if (dim === 'pressure') {
    const unit = r.unit as PressureReadingUnit
    const kpa = sheet.attempt(name, 'The reading is left out.', () => props.toKpaAbs(value, unit, atmosphericKpa))
    if (kpa === undefined) return undefined
    if (kpa <= 0) {
      sheet.warn(`${name} of ${value} ${r.unit} is at or below a perfect vacuum; check the sign and the unit. The reading is left out.`)
      return undefined
    }
    const shown = Math.abs(value) * KPA_PER_UNIT[unit]
    return { value: kpa, sigma: quadrature((step * KPA_PER_UNIT[unit]) / Math.sqrt(12), GAUGE_RELATIVE * shown, GAUGE_FLOOR_KPA) }
  }
  if (dim === 'temperature') {
    const unit = r.unit as TemperatureReadingUnit
    const celsius = sheet.attempt(name, 'The reading is left out.', () => props.toCelsius(value, unit))
    if (celsius === undefined) return undefined
    return { value: celsius, sigma: quadrature((step * KELVIN_PER_UNIT[unit]) / Math.sqrt(12), PROBE_K) }
  }
  if (value < 0) {
    sheet.warn(`${name} of ${value} ${r.unit} is negative; the reading is left out.`)
    return undefined
  }
  return { value, sigma: dim === 'current' ? quadrature(step / Math.sqrt(12), CLAMP_RELATIVE * value) : 0 }
}

/** Local atmospheric pressure for gauge readings: given, from the site's altitude (ISO 2533), or 101.325 kPa. */
export function atmosphericPressureOf(request: RankRequest): number {
  if (request.site?.atmosphericKpa !== undefined) return request.site.atmosphericKpa
  if (request.site?.altitudeM !== undefined) return props.atmosphericPressureAtAltitude(request.site.altitudeM)
  return 101.325
}

const PHASE_WORDS = { repair: 'during the repair', verification: 'to verify the repair' } as const

function describe(r: Reading): string {
  const shown = typeof r.value === 'boolean' ? (r.value ? 'yes' : 'no') : `${r.value} ${r.unit}`
  return `${readingName(r.quantity, r.stage)} ${shown}`
}

export function normaliseReadings(request: RankRequest, sheet: FactSheet): NormalisedReadings {
  const values = new Map<string, NormalisedReading>()
  const setAside: string[] = []
  const stages = new Set<Stage>(request.unit.stages.map((s) => s.stage))
  const atmosphericKpa = atmosphericPressureOf(request)
  for (const r of request.readings ?? []) {
    if (r.phase && r.phase !== 'diagnosis') {
      setAside.push(`${describe(r)}, taken ${PHASE_WORDS[r.phase]}, is kept in the record but does not move the diagnosis.`)
      continue
    }
    if (r.stage && !stages.has(r.stage)) {
      sheet.warn(`${describe(r)}: this unit has no ${r.stage} stage, so the reading is left out.`)
      continue
    }
    const normalised = normalise(r, atmosphericKpa, sheet)
    if (!normalised) continue
    if (values.has(readingKey(r))) sheet.warn(`${readingName(r.quantity, r.stage)} was entered more than once; the last value is used.`)
    values.set(readingKey(r), normalised)
  }
  return { values, atmosphericKpa, setAside }
}

export function readingValue(readings: NormalisedReadings, quantity: Quantity, stage?: Stage): NormalisedReading | undefined {
  return readings.values.get(stage ? `${stage}:${quantity}` : quantity)
}
