/**
 * Pressures as the technician reads them, and the checks of a standing pressure against a stage's design
 * pressure. Shared by the substitution planner, the charging calculator and the standing-pressure route.
 */
import { PRESSURE_UNIT_LABELS, fromKpaAbs, type AnyPressureUnit } from '#shared/utils/properties'
import { fmtC, fmtKpa } from '#shared/utils/properties/errors'

/**
 * Above this ambient a stage at standstill is not expected to stand (a hot plant room, a van in summer):
 * a fill that reaches its design pressure below it is at risk. Common practice, no source.
 */
export const MAX_STANDSTILL_AMBIENT_C = 50
/** Within this fraction of the design pressure a few kelvin of warming can lift the relief valve. */
export const NEAR_DESIGN_PRESSURE = 0.9

/** A pressure in absolute kPa and in the unit the technician's gauge reads. */
export interface PressureReading {
  pressureKpa: number
  value: number
  unit: AnyPressureUnit
  /** True for gauge units, which depend on `atmosphericKpa`. */
  gauge: boolean
  atmosphericKpa: number
  /** "98.6 psig", with the unit's own decimals. */
  text: string
}

/** The same absolute pressure in the display unit (gauge units against the given atmosphere). */
export function pressureReading(pressureKpa: number, display: { unit: AnyPressureUnit; atmosphericKpa: number }): PressureReading {
  const label = PRESSURE_UNIT_LABELS[display.unit]
  const value = fromKpaAbs(pressureKpa, display.unit, display.atmosphericKpa)
  const text = `${value.toFixed(label.decimals).replace(/^-(0\.?0*)$/, '$1')} ${label.short}`
  return { pressureKpa, value, unit: display.unit, gauge: label.gauge, atmosphericKpa: display.atmosphericKpa, text }
}

/** Absolute kPa, with the reading in the display unit beside it when that unit is not kPa abs. */
export function pressureText(pressureKpa: number, display: { unit: AnyPressureUnit; atmosphericKpa: number }): string {
  const abs = `${fmtKpa(pressureKpa)} abs`
  return display.unit === 'kPa' ? abs : `${abs} (${pressureReading(pressureKpa, display).text})`
}

/**
 * Warnings for a standing pressure against the stage's design pressure (kPa abs): above it is a danger,
 * close to it or reaching it on an ordinary warm day is a caution.
 */
export function designPressureWarnings(
  standingKpa: number, designKpa: number, reachesAtC: number | undefined, ambientC: number,
  display: { unit: AnyPressureUnit; atmosphericKpa: number },
): string[] {
  const design = pressureText(designKpa, display)
  const standing = pressureText(standingKpa, display)
  if (standingKpa > designKpa) {
    return [`DANGER: at ${fmtC(ambientC)} this stands at ${standing}, above the stage's design pressure ${design}. Do not charge this much; if it is already in, recover refrigerant into a rated cylinder until the pressure is well below the design pressure.`]
  }
  if (standingKpa >= designKpa * NEAR_DESIGN_PRESSURE) {
    return [`Close to the design pressure: ${standing} at ${fmtC(ambientC)} against ${design}. A few kelvin of warming can lift the relief valve.`]
  }
  if (reachesAtC !== undefined && reachesAtC <= MAX_STANDSTILL_AMBIENT_C) {
    return [`At standstill this charge reaches the stage's design pressure ${design} when the ambient reaches ${fmtC(reachesAtC)}: a hot plant room or transport in summer can lift the relief valve.`]
  }
  return []
}
