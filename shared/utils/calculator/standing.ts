/** Standing-pressure calculations shaped as the API answers them; the calculator page uses the same. */
import type { StandingRequest } from '#shared/schemas/properties'
import type { StandingDto } from '#shared/types/properties-dto'
import {
  chargeFromStandingPressure, shiftStandingPressure, standingPressureFromCharge,
  type RefrigerantInfo, type StandingResult,
} from '#shared/utils/properties'

function common(info: RefrigerantInfo, ambientC: number, r: StandingResult) {
  return {
    designation: info.designation,
    ambientC,
    phase: r.phase,
    note: r.note,
    densityKgM3: r.densityKgM3,
    ...(r.saturationPressureKpa !== undefined ? { saturationPressureKpa: r.saturationPressureKpa } : {}),
    ...(r.warmAboveC !== undefined ? { warmAboveC: r.warmAboveC } : {}),
    cautions: info.cautions,
  }
}

/** Runs one standing-pressure request; property errors (OutOfRangeError) pass through to the caller. */
export function standingCheck(info: RefrigerantInfo, req: StandingRequest): StandingDto {
  const designation = info.designation
  if (req.mode === 'charge') {
    const r = standingPressureFromCharge({ designation, ambientC: req.ambientC, volumeL: req.volumeL, chargeG: req.chargeG })
    return { mode: 'charge', ...common(info, req.ambientC, r), volumeL: req.volumeL, chargeG: req.chargeG, pressureKpa: r.pressureKpa }
  }
  if (req.mode === 'pressure') {
    const r = chargeFromStandingPressure({ designation, ambientC: req.ambientC, volumeL: req.volumeL, pressureKpa: req.pressureKpa })
    // With liquid present the pressure only bounds the charge from below (saturated vapour filling the volume).
    return { mode: 'pressure', ...common(info, req.ambientC, r), volumeL: req.volumeL, pressureKpa: req.pressureKpa, chargeG: r.chargeG, chargeIsMinimum: r.phase === 'two-phase' }
  }
  const r = shiftStandingPressure({ designation, ambientC: req.ambientC, referencePressureKpa: req.referencePressureKpa, referenceAmbientC: req.referenceAmbientC })
  const withVolume = req.volumeL !== undefined ? { volumeL: req.volumeL, chargeG: r.densityKgM3 * req.volumeL } : {}
  return {
    mode: 'shift', ...common(info, req.ambientC, r), referencePressureKpa: req.referencePressureKpa, referenceAmbientC: req.referenceAmbientC,
    pressureKpa: r.pressureKpa, ...withVolume,
  }
}
