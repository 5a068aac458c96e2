/** Charge-planning requests shaped as the API answers them: designations resolved (404), pressures converted (422). */
import type { ChargingRequest, SubstitutionRequest } from '#shared/schemas/charging'
import type { ChargingDto, SubstitutionDto } from '#shared/types/charging-dto'
import { assertWithinEos, type Designation } from '#shared/utils/properties'
import { chargingProgress } from '#shared/utils/charging/charging-progress'
import { planSubstitution } from '#shared/utils/charging/substitution'
import { absoluteKpa } from './pressure'
import { resolveRefrigerant } from './saturation'

const designOf = (req: { designPressure?: SubstitutionRequest['designPressure'] }) =>
  req.designPressure ? { designPressureKpa: absoluteKpa(req.designPressure, 'designPressure') } : {}

/** Plans a substitution; unknown designations throw UnknownRefrigerantError, states outside the models OutOfRangeError. */
export function substitutionPlan(req: SubstitutionRequest): SubstitutionDto {
  const from: Designation = resolveRefrigerant(req.from.designation).designation
  const to: Designation = resolveRefrigerant(req.to).designation
  return planSubstitution({
    volumeL: req.volumeL, ambientC: req.ambientC, from: { designation: from, chargeG: req.from.chargeG }, to, basis: req.basis,
    ...(req.evaporatingC !== undefined ? { evaporatingC: req.evaporatingC } : {}),
    ...(req.condensingC !== undefined ? { condensingC: req.condensingC } : {}),
    ...designOf(req),
    display: req.display,
  })
}

/** One charging reading against its target. */
export function chargingCheck(req: ChargingRequest): ChargingDto {
  const designation = resolveRefrigerant(req.designation).designation
  const reading = req.reading.by === 'pressure'
    ? { by: 'pressure' as const, pressureKpa: absoluteKpa(req.reading.pressure, 'pressure') }
    : req.reading
  const progress = chargingProgress({
    designation, volumeL: req.volumeL, ambientC: req.ambientC, targetChargeG: req.targetChargeG, display: req.display, ...designOf(req),
  }, reading)
  assertWithinEos(designation, { pressureKpa: progress.standingPressureKpa, densityKgM3: progress.chargeNowG / req.volumeL }, req.ambientC)
  return progress
}
