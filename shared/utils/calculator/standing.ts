/** Standing-pressure calculations shaped as the API answers them; the calculator page uses the same. */
import type { StandingRequest } from '#shared/schemas/properties'
import type { StandingDto } from '#shared/types/properties-dto'
import { designPressureWarnings, pressureReading } from '#shared/utils/charging/readings'
import {
  ambientAtStandingPressure, assertWithinEos, chargeFromStandingPressure, shiftStandingPressure, standingPressureFromCharge,
  type RefrigerantInfo, type StandingResult,
} from '#shared/utils/properties'
import { absoluteKpa, typedInput } from './pressure'

function common(info: RefrigerantInfo, req: StandingRequest, r: StandingResult, designPressureKpa: number | undefined) {
  assertWithinEos(info.designation, r, req.ambientC)
  const reachesDesignPressureAtC = designPressureKpa !== undefined
    ? ambientAtStandingPressure(info.designation, r.densityKgM3, designPressureKpa, req.ambientC)
    : undefined
  const design = designPressureKpa !== undefined
    ? designPressureWarnings(r.pressureKpa, designPressureKpa, reachesDesignPressureAtC, req.ambientC, req.display)
    : []
  // Loud first: liquid-full, then above the design pressure, then the rest.
  const [loud, rest] = [r.warnings.filter((w) => w.startsWith('LIQUID-FULL')), r.warnings.filter((w) => !w.startsWith('LIQUID-FULL'))]
  return {
    designation: info.designation,
    ambientC: req.ambientC,
    phase: r.phase,
    note: r.note,
    warnings: [...loud, ...design, ...rest],
    densityKgM3: r.densityKgM3,
    kpaPerK: r.kpaPerK,
    reading: pressureReading(r.pressureKpa, req.display),
    ...(r.saturationPressureKpa !== undefined ? { saturationPressureKpa: r.saturationPressureKpa } : {}),
    ...(r.saturatedLiquidDensityKgM3 !== undefined ? { saturatedLiquidDensityKgM3: r.saturatedLiquidDensityKgM3 } : {}),
    ...(r.warmAboveC !== undefined ? { warmAboveC: r.warmAboveC } : {}),
    ...(r.liquidFullAboveC !== undefined ? { liquidFullAboveC: r.liquidFullAboveC } : {}),
    ...(designPressureKpa !== undefined ? { designPressureKpa } : {}),
    ...(reachesDesignPressureAtC !== undefined ? { reachesDesignPressureAtC } : {}),
    cautions: info.cautions,
  }
}

/** Runs one standing-pressure request; property errors (OutOfRangeError) pass through to the caller. */
export function standingCheck(info: RefrigerantInfo, req: StandingRequest): StandingDto {
  return computeStanding(info, req)
}

function computeStanding(info: RefrigerantInfo, req: StandingRequest): StandingDto {
  const designation = info.designation
  const designPressureKpa = req.designPressure ? absoluteKpa(req.designPressure, 'designPressure') : undefined
  if (req.mode === 'charge') {
    const r = standingPressureFromCharge({ designation, ambientC: req.ambientC, volumeL: req.volumeL, chargeG: req.chargeG })
    return { mode: 'charge', ...common(info, req, r, designPressureKpa), volumeL: req.volumeL, chargeG: req.chargeG, pressureKpa: r.pressureKpa }
  }
  if (req.mode === 'pressure') {
    const pressureKpa = absoluteKpa(req.pressure, 'pressure')
    const r = chargeFromStandingPressure({ designation, ambientC: req.ambientC, volumeL: req.volumeL, pressureKpa })
    const input = typedInput(req.pressure)
    // With liquid present the pressure only bounds the charge from below (saturated vapour filling the volume).
    return {
      mode: 'pressure', ...common(info, req, r, designPressureKpa), volumeL: req.volumeL, pressureKpa, chargeG: r.chargeG,
      chargeIsMinimum: r.phase === 'two-phase', ...(input ? { input } : {}),
    }
  }
  const r = shiftStandingPressure({ designation, ambientC: req.ambientC, referencePressureKpa: req.referencePressureKpa, referenceAmbientC: req.referenceAmbientC })
  const withVolume = req.volumeL !== undefined ? { volumeL: req.volumeL, chargeG: r.densityKgM3 * req.volumeL } : {}
  return {
    mode: 'shift', ...common(info, req, r, designPressureKpa), referencePressureKpa: req.referencePressureKpa, referenceAmbientC: req.referenceAmbientC,
    pressureKpa: r.pressureKpa, ...withVolume,
  }
}
