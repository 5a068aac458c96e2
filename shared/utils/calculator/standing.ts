/** Standing-pressure calculations shaped as the API answers them; the calculator page uses the same. */
import type { StandingRequest } from '#shared/schemas/properties'
import type { StandingDto } from '#shared/types/properties-dto'
import {
  OutOfRangeError, chargeFromStandingPressure, shiftStandingPressure, standingPressureFromCharge,
  type RefrigerantInfo, type StandingResult,
} from '#shared/utils/properties'
import { fmtC, fmtKpa } from '#shared/utils/properties/errors'
import { fluidModel } from '#shared/utils/properties/model'

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

/**
 * A typing slip (1000 g in 1 L of ethylene) sends the equation of state far past the pressures it was
 * fitted to, where it still returns a number (GPa). Refuse such fills, naming the valid range.
 */
function plausible<T extends StandingDto>(info: RefrigerantInfo, dto: T): T {
  const maxKpa = fluidModel(info.designation).pmax / 1000
  if (!Number.isFinite(dto.densityKgM3) || !Number.isFinite(dto.pressureKpa) || dto.pressureKpa > maxKpa) {
    const range = { minC: info.validRange.minC, maxC: info.validRange.maxC, minKpa: 0, maxKpa }
    throw new OutOfRangeError(`${info.designation}: this fill would stand above ${fmtKpa(maxKpa)} at ${fmtC(dto.ambientC)}, beyond the range of its equation of state (0 to ${fmtKpa(maxKpa)}). Check the charge and the volume.`, range)
  }
  return dto
}

/** Runs one standing-pressure request; property errors (OutOfRangeError) pass through to the caller. */
export function standingCheck(info: RefrigerantInfo, req: StandingRequest): StandingDto {
  return plausible(info, computeStanding(info, req))
}

function computeStanding(info: RefrigerantInfo, req: StandingRequest): StandingDto {
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
