// Whether a reading can be true before it enters a case record. Two tiers:
// - impossible: no instrument on a working unit can show it (a temperature below absolute zero, an
//   absolute pressure below zero, a refrigerant state outside its reference equation of state, a
//   negative current or run time). Refused outright; the case is left as it was.
// - outside the design envelope: physically possible but far beyond what the unit is built for
//   (a pressure above the stage's design pressure or the refrigerant's critical pressure, a cabinet
//   at -200 °C). Kept only when the technician confirms it with a reason; the record marks it.
// Envelope limits are common practice, no source: they catch typing slips (a missing minus sign,
// psig typed as kPa) without refusing a true but alarming reading.
// A refrigerant pressure above what any refrigeration stage can hold is impossible too, even where
// the refrigerant's equation of state reaches further (ethane's runs to 900 MPa): see
// STAGE_CEILING_KPA and DESIGN_PRESSURE_CEILING_TIMES.
// Pure: no I/O.
import type { Reading, Stage } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { formatPressure, formatQuantity } from '#shared/utils/format'
import type { FieldErrors } from '#shared/utils/input-errors'
import { eosLimits, findRefrigerant, isDesignation, toCelsius, toKpaAbs } from '#shared/utils/properties'
import { readingName } from '#shared/utils/vocabulary'

/** Refrigerant pressures measured on a stage. */
const REFRIGERANT_PRESSURES = new Set(['suctionPressure', 'dischargePressure', 'standingPressure'])
/** Temperatures of the refrigerant itself (on its lines), which its equation of state bounds. */
const REFRIGERANT_TEMPERATURES = new Set(['suctionTemperature', 'dischargeTemperature', 'liquidLineTemperature'])

/** Envelope of temperatures by quantity, °C (common practice, no source). */
const TEMPERATURE_ENVELOPE: Record<string, [number, number]> = {
  cabinetTemperature: [-160, 80],
  setpointTemperature: [-160, 80],
  evaporatorTemperature: [-170, 80],
  cascadeHxTemperature: [-120, 60],
  ambientTemperature: [-40, 60],
  condenserAirInTemperature: [-40, 60],
  condenserAirOutTemperature: [-40, 80],
  suctionTemperature: [-170, 100],
  liquidLineTemperature: [-170, 90],
  dischargeTemperature: [-120, 160],
}
/** A current this many times the rated one is beyond a locked rotor's typical draw (common practice, no source). */
const CURRENT_TIMES_RATED = 3
/** Without a rating: a single-phase or small three-phase compressor of these units draws far less (common practice, no source). */
const CURRENT_WITHOUT_RATING_A = 80
/** Readings above the design pressure by more than this share ask for confirmation. */
const DESIGN_PRESSURE_MARGIN = 1.1
/**
 * Absolute pressure (kPa) no refrigeration stage holds: the highest pressures in refrigeration
 * service, transcritical R744 gas coolers, stay below about 14 MPa, and the small cascade and
 * single-stage units here are built for far less (common practice, no source).
 */
export const STAGE_CEILING_KPA = 20_000
/**
 * Pressure parts are commonly proven to burst at a few times (three to five) their design pressure;
 * a stage reading above five times its nameplate design pressure would have burst (common practice, no source).
 */
export const DESIGN_PRESSURE_CEILING_TIMES = 5

/** The highest refrigerant pressure (absolute kPa) a stage can physically hold, and why. */
export function stageCeiling(designPressureKpa: number | null | undefined): { kpa: number; why: string } {
  if (designPressureKpa && designPressureKpa * DESIGN_PRESSURE_CEILING_TIMES < STAGE_CEILING_KPA) {
    return { kpa: designPressureKpa * DESIGN_PRESSURE_CEILING_TIMES, why: `${DESIGN_PRESSURE_CEILING_TIMES} times the stage's design pressure of ${formatPressure(designPressureKpa, { decimals: 0 })}; the stage would have burst` }
  }
  return { kpa: STAGE_CEILING_KPA, why: 'more than any refrigeration stage is built to hold' }
}

export interface EnvelopeQuestion {
  index: number
  message: string
}

export interface PlausibilityVerdict {
  /** Field messages of readings that cannot be true, keyed `readings.{i}.value`; empty when none. */
  impossible: FieldErrors
  /** Readings outside the design envelope that need a confirmation with a reason. */
  outsideEnvelope: EnvelopeQuestion[]
}

/** A unit's stage as the checks need it; `designPressureKpa` is optional so older units check against the refrigerant. */
type StageInfo = { stage: Stage; refrigerant: string; ratedCurrentA: number | null; designPressureKpa?: number | null }

function stageOf(unit: Pick<UnitDto, 'stages'>, stage?: Stage): StageInfo | undefined {
  return (unit.stages as StageInfo[]).find((s) => s.stage === stage)
}

function checkOne(r: Reading, unit: Pick<UnitDto, 'stages'>, atmosphericKpa: number): { impossible?: string; envelope?: string } {
  if (typeof r.value !== 'number') return {}
  const name = readingName(r)
  const shown = formatQuantity(r.value, r.unit)
  const stage = stageOf(unit, r.stage)
  const designation = stage && isDesignation(stage.refrigerant) ? stage.refrigerant : undefined

  if (r.unit === 'C' || r.unit === 'F' || r.unit === 'K') {
    const c = r.unit === 'C' ? r.value : r.unit === 'F' ? ((r.value - 32) * 5) / 9 : r.value - 273.15
    if (c < -273.15) return { impossible: `${name} ${shown} is below absolute zero (−273.15 °C); no thermometer can read it.` }
    const celsius = toCelsius(r.value, r.unit)
    if (designation && REFRIGERANT_TEMPERATURES.has(r.quantity)) {
      const limits = eosLimits(designation)
      const pure = findRefrigerant(designation)?.kind === 'pure'
      if (celsius > limits.maxC || (pure && celsius < limits.minC)) {
        return {
          impossible: `${name} ${shown} is not a state ${designation} can be in: its equation of state covers ${formatQuantity(limits.minC, 'C', 0)} to ${formatQuantity(limits.maxC, 'C', 0)}.`,
        }
      }
    }
    const envelope = TEMPERATURE_ENVELOPE[r.quantity]
    if (envelope && (celsius < envelope[0] || celsius > envelope[1])) {
      return { envelope: `${name} ${shown} is far outside what this unit runs at (${formatQuantity(envelope[0], 'C', 0)} to ${formatQuantity(envelope[1], 'C', 0)}).` }
    }
    return {}
  }

  if (REFRIGERANT_PRESSURES.has(r.quantity)) {
    let kpa: number
    try {
      kpa = toKpaAbs(r.value, r.unit, atmosphericKpa)
    } catch (error) {
      return { impossible: `${name} ${shown}: ${error instanceof Error ? error.message : 'not a pressure'}` }
    }
    if (kpa < 0) {
      return {
        impossible: `${name} ${shown} is ${formatPressure(kpa, { decimals: 0 })}: below a perfect vacuum. A gauge reads no lower than ${formatPressure(0, { unit: r.unit as never, atmosphericKpa, decimals: 1 })} here; check the sign and the unit.`,
      }
    }
    if (designation) {
      const limits = eosLimits(designation)
      if (kpa > limits.maxKpa) {
        return { impossible: `${name} ${shown} is above ${formatPressure(limits.maxKpa, { decimals: 0 })}, beyond any state ${designation}'s equation of state covers; check the unit and the figure.` }
      }
    }
    const ceiling = stageCeiling(stage?.designPressureKpa)
    if (kpa > ceiling.kpa) {
      return { impossible: `${name} ${shown} is above ${formatPressure(ceiling.kpa, { decimals: 0 })}, ${ceiling.why}; check the unit and the figure.` }
    }
    if (designation) {
      const design = stage?.designPressureKpa ?? null
      if (design !== null && kpa > design * DESIGN_PRESSURE_MARGIN) {
        return { envelope: `${name} ${shown} is above the stage's design pressure of ${formatPressure(design, { decimals: 0 })}.` }
      }
      const critical = findRefrigerant(designation)?.criticalPressureKpa
      if (design === null && critical !== undefined && kpa > critical) {
        return { envelope: `${name} ${shown} (${formatPressure(kpa, { decimals: 0 })}) is above the critical pressure of ${designation} (${formatPressure(critical, { decimals: 0 })}), far beyond what such a stage runs or stands at.` }
      }
    }
    return {}
  }

  if (r.quantity === 'compressorCurrent') {
    if (r.value < 0) return { impossible: `${name} ${shown}: a current is never below 0 A as a clamp meter reads it.` }
    const rated = stage?.ratedCurrentA ?? null
    const limit = rated ? rated * CURRENT_TIMES_RATED : CURRENT_WITHOUT_RATING_A
    if (r.value > limit) {
      return { envelope: `${name} ${shown} is above ${formatQuantity(limit, 'A', 0)}${rated ? ` (${CURRENT_TIMES_RATED} times the rated ${formatQuantity(rated, 'A', 1)})` : ''}.` }
    }
    return {}
  }
  if (r.quantity === 'runtime' && r.value < 0) return { impossible: `${name} ${shown}: a run time is never below zero.` }
  return {}
}

/**
 * Checks readings against physics and the unit's design envelope. `confirmed` holds the indexes
 * the technician confirmed with a reason; those are not asked again.
 */
export function checkReadings(
  unit: Pick<UnitDto, 'stages'>, readings: readonly Reading[], atmosphericKpa: number, confirmed: ReadonlySet<number> = new Set(),
): PlausibilityVerdict {
  const impossible: FieldErrors = {}
  const outsideEnvelope: EnvelopeQuestion[] = []
  readings.forEach((r, index) => {
    const verdict = checkOne(r, unit, atmosphericKpa)
    if (verdict.impossible) impossible[`readings.${index}.value`] = [verdict.impossible]
    else if (verdict.envelope && !confirmed.has(index)) outsideEnvelope.push({ index, message: verdict.envelope })
  })
  return { impossible, outsideEnvelope }
}

/** The envelope message of one reading, or undefined when it is within the envelope (for marking confirmed readings). */
export function envelopeMessage(unit: Pick<UnitDto, 'stages'>, reading: Reading, atmosphericKpa: number): string | undefined {
  return checkOne(reading, unit, atmosphericKpa).envelope
}
