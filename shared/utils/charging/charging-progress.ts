/**
 * Charging a gas-charged stage by standing pressure: as gas goes in, the technician reads the standing
 * pressure and the ambient and sees the grams now in the stage, the grams still to go and the share of the
 * target; or types the grams weighed in and sees the pressure to expect. The equation of state turns one
 * into the other (the charge is not proportional to the pressure). Pure, for the calculator page now and for
 * the case record's charging steps later.
 */
import {
  ambientAtStandingPressure, chargeFromStandingPressure, findRefrigerant, saturationTemperature, standingPressureFromCharge,
  type AnyPressureUnit, type Designation, type StandingPhase,
} from '#shared/utils/properties'
import { fmtC, fmtKpa } from '#shared/utils/properties/errors'
import { designPressureWarnings, pressureReading, type PressureReading } from './readings'

/** Within this share of the target the charge is done, pending a settled re-read: common practice, no source. */
export const ON_TARGET_FRACTION = 0.02
/** A blend whose glide at 1 atm exceeds this separates when charged as vapour (common practice, no source). */
const SEPARATING_GLIDE_K = 0.2

export interface ChargingInput {
  designation: Designation
  volumeL: number
  ambientC: number
  targetChargeG: number
  display: { unit: AnyPressureUnit; atmosphericKpa: number }
  designPressureKpa?: number
}

/** What the technician has: a standing-pressure reading (absolute kPa), or the grams weighed in on top of a starting charge. */
export type ChargingReading = { by: 'pressure'; pressureKpa: number } | { by: 'weight'; addedG: number; startG: number }

export interface ChargingProgress {
  by: 'pressure' | 'weight'
  designation: Designation
  ambientC: number
  volumeL: number
  targetChargeG: number
  /** Grams in the stage now: estimated from the pressure, or weighed. */
  chargeNowG: number
  /** True when liquid is present, so the pressure only bounds the charge from below. */
  chargeIsMinimum: boolean
  /** Target minus now; negative when over the target. */
  toGoG: number
  percentOfTarget: number
  /** The standing pressure read (by pressure) or to expect (by weight), with its display reading. */
  standingPressureKpa: number
  reading: PressureReading
  phase: StandingPhase
  /** Where the target charge stands at this ambient: the reading to charge to (null when pressure cannot show it). */
  target: { standingPressureKpa: number; phase: StandingPhase; reading: PressureReading | null }
  note: string
  warnings: string[]
  /** Cautions for this charging step. */
  cautions: string[]
}

/** Progress of a charge toward its target from one reading. */
export function chargingProgress(input: ChargingInput, reading: ChargingReading): ChargingProgress {
  const { designation, ambientC, volumeL, targetChargeG } = input
  const target = standingPressureFromCharge({ designation, ambientC, volumeL, chargeG: targetChargeG })
  const now = reading.by === 'pressure'
    ? chargeFromStandingPressure({ designation, ambientC, volumeL, pressureKpa: reading.pressureKpa })
    : standingPressureFromCharge({ designation, ambientC, volumeL, chargeG: reading.startG + reading.addedG })
  const chargeNowG = reading.by === 'pressure' ? now.chargeG : reading.startG + reading.addedG
  const chargeIsMinimum = reading.by === 'pressure' && now.phase === 'two-phase'
  const toGoG = targetChargeG - chargeNowG
  const targetMeasurable = target.phase === 'gas' || target.phase === 'supercritical'
  const warnings = [...now.warnings]
  if (!targetMeasurable) {
    warnings.push(`The target ${targetChargeG.toFixed(0)} g of ${designation} is ${target.phase === 'liquid' ? 'liquid-full' : 'partly liquid'} at ${fmtC(ambientC)}: the standing pressure cannot confirm it. Charge it by weight on a scale.`)
  }
  if (toGoG < -Math.max(1, ON_TARGET_FRACTION * targetChargeG)) {
    warnings.push(`Over the target by ${(-toGoG).toFixed(0)} g: stop charging and recover the excess into a rated cylinder.`)
  }
  if (input.designPressureKpa !== undefined) {
    const reachesAtC = ambientAtStandingPressure(designation, chargeNowG / volumeL, input.designPressureKpa, ambientC)
    warnings.push(...designPressureWarnings(now.pressureKpa, input.designPressureKpa, reachesAtC, ambientC, input.display))
  }
  return {
    by: reading.by, designation, ambientC, volumeL, targetChargeG,
    chargeNowG, chargeIsMinimum, toGoG, percentOfTarget: (chargeNowG / targetChargeG) * 100,
    standingPressureKpa: now.pressureKpa, reading: pressureReading(now.pressureKpa, input.display), phase: now.phase,
    target: { standingPressureKpa: target.pressureKpa, phase: target.phase, reading: targetMeasurable ? pressureReading(target.pressureKpa, input.display) : null },
    note: progressNote(reading.by, chargeIsMinimum, toGoG, targetChargeG, now.pressureKpa),
    warnings,
    cautions: chargingCautions(designation),
  }
}

function progressNote(by: 'pressure' | 'weight', minimum: boolean, toGoG: number, targetG: number, pKpa: number): string {
  if (minimum) return `At the saturation pressure (${fmtKpa(pKpa)} abs) liquid is present: the stage holds at least the grams shown, and the pressure cannot tell how much more. Go on by weight.`
  if (Math.abs(toGoG) <= ON_TARGET_FRACTION * targetG) return 'On target. Let the stage settle at ambient, read again, then close the valves.'
  if (toGoG > 0) return by === 'pressure' ? `About ${toGoG.toFixed(0)} g to go.` : `Expect this pressure once the stage has settled; about ${toGoG.toFixed(0)} g to go.`
  return 'Over the target.'
}

/** The cautions that belong at the charging step. */
export function chargingCautions(designation: Designation): string[] {
  const info = findRefrigerant(designation)!
  const out = [
    'Read the standing pressure with the stage off and settled: gas cools as it expands into the stage, so a reading taken straight after adding gas is low. Wait until the stage is back at room temperature.',
    `Charge through a hose and gauge set rated for ${designation}, with the cylinder on a scale; never heat the cylinder with a flame.`,
  ]
  if (info.flammable) out.push(`${designation} is flammable: no ignition sources nearby, ventilate, and use a recovery machine and leak detector rated for flammable refrigerants.`)
  if (info.kind === 'blend') {
    const nbp = saturationTemperature(designation, 101.325)
    if (nbp.dewC - nbp.bubbleC > SEPARATING_GLIDE_K) out.push(`${designation} is a blend with a glide: take liquid from the cylinder and meter it in slowly so the blend's make-up stays as made.`)
  }
  return out
}
