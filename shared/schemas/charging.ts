/**
 * Inputs of charge planning: `POST /api/calculations/substitution` and `POST /api/calculations/charging`.
 * The calculator page checks its forms with the same schemas. Designations are checked for shape only:
 * an unknown one is a 404 from the route, not a 400.
 */
import { z } from 'zod'
import { SUBSTITUTION_BASES, type SubstitutionBasis } from '#shared/utils/charging/substitution'
import type { AnyPressureUnit } from '#shared/utils/properties'
import { given, pressureContext, pressureContextFields, type PressureGiven } from './properties'

const bodyNumber = (label: string) => z.number({ error: `${label} must be a number` })
const designation = (label: string) =>
  z.string({ error: `Give the ${label} designation, e.g. R1150` }).trim().min(1, `Give the ${label} designation, e.g. R1150`).max(20, 'Designation too long')
const volumeL = bodyNumber('Internal volume (L)').positive('Internal volume must be above 0 L').max(100_000, 'Internal volume must be at most 100 000 L')
const grams = (label: string) => bodyNumber(label).positive(`${label} must be above 0 g`).max(10_000_000, `${label} must be at most 10 000 000 g`)

/** A substitution request after checking: pressures still as given (converted by the route, so a sub-vacuum value is a 422). */
export interface SubstitutionRequest {
  volumeL: number
  ambientC: number
  from: { designation: string; chargeG: number }
  to: string
  basis: SubstitutionBasis
  evaporatingC?: number
  condensingC?: number
  designPressure?: PressureGiven
  display: { unit: AnyPressureUnit; atmosphericKpa: number }
}

/**
 * `{ volumeL, ambientC, from: { designation, chargeG }, to, basis, evaporatingC }` plus, optionally, the
 * stage's condensing temperature and design pressure, and the unit (gauge at `altitudeM`) to show the
 * standing pressure to charge to.
 */
export const SubstitutionBodySchema = z
  .object({
    volumeL,
    ambientC: bodyNumber('Ambient temperature (°C)'),
    from: z.object(
      { designation: designation('nameplate refrigerant'), chargeG: grams('Nameplate charge') },
      { error: 'Give the nameplate refrigerant and charge: from: { designation, chargeG }' },
    ),
    to: designation('substitute refrigerant'),
    basis: z.enum(SUBSTITUTION_BASES, { error: `basis must be one of: ${SUBSTITUTION_BASES.join(', ')}` }),
    evaporatingC: bodyNumber('Design evaporating temperature (°C)').optional(),
    condensingC: bodyNumber('Condensing temperature (°C)').optional(),
    ...pressureContextFields,
  })
  .transform((b, ctx): SubstitutionRequest => {
    const context = pressureContext(b, ctx)
    if (b.basis === 'liquid-volume' && b.evaporatingC === undefined) {
      ctx.addIssue({ code: 'custom', message: 'The liquid-volume basis needs the design evaporating temperature (evaporatingC)', path: ['evaporatingC'] })
      return z.NEVER
    }
    if (!context) return z.NEVER
    return {
      volumeL: b.volumeL, ambientC: b.ambientC, from: b.from, to: b.to, basis: b.basis,
      ...(b.evaporatingC !== undefined ? { evaporatingC: b.evaporatingC } : {}),
      ...(b.condensingC !== undefined ? { condensingC: b.condensingC } : {}),
      ...context,
    }
  })

/** A charging-progress request after checking. */
export interface ChargingRequest {
  designation: string
  volumeL: number
  ambientC: number
  targetChargeG: number
  reading: { by: 'pressure'; pressure: PressureGiven } | { by: 'weight'; addedG: number; startG: number }
  designPressure?: PressureGiven
  display: { unit: AnyPressureUnit; atmosphericKpa: number }
}

const READINGS = 'Give the standing pressure (pressureKpa, or pressure with a unit) or the grams weighed in (addedG), not both'

/**
 * `POST /api/calculations/charging`: the stage, its target charge and one reading taken while charging:
 * the standing pressure now, or the grams weighed in so far (on top of `startG`, 0 for an evacuated stage).
 */
export const ChargingBodySchema = z
  .object({
    designation: designation('refrigerant'),
    volumeL,
    ambientC: bodyNumber('Ambient temperature (°C)'),
    targetChargeG: grams('Target charge'),
    pressureKpa: bodyNumber('Standing pressure (kPa, absolute)').positive('Absolute pressure must be above 0 kPa (gauge readings: send pressure with a unit such as psig)').optional(),
    pressure: bodyNumber('Standing pressure').optional(),
    addedG: bodyNumber('Grams weighed in').nonnegative('Grams weighed in cannot be negative').max(10_000_000, 'Grams weighed in must be at most 10 000 000 g').optional(),
    startG: bodyNumber('Charge before this fill (g)').nonnegative('The charge before this fill cannot be negative').max(10_000_000, 'The charge before this fill must be at most 10 000 000 g').optional(),
    ...pressureContextFields,
  })
  .transform((b, ctx): ChargingRequest => {
    const context = pressureContext(b, ctx)
    const measured = given(b, 'pressure', 'pressureKpa', ctx)
    if (!context || measured === null) return z.NEVER
    if ((measured === undefined) === (b.addedG === undefined)) {
      const present = (['pressureKpa', 'pressure', 'addedG'] as const).filter((k) => b[k] !== undefined)
      for (const path of present.length ? present : (['pressureKpa', 'addedG'] as const)) ctx.addIssue({ code: 'custom', message: READINGS, path: [path] })
      return z.NEVER
    }
    if (b.startG !== undefined && b.addedG === undefined) {
      ctx.addIssue({ code: 'custom', message: 'startG goes with addedG (grams weighed in on top of it)', path: ['startG'] })
      return z.NEVER
    }
    const reading = measured !== undefined
      ? { by: 'pressure' as const, pressure: measured }
      : { by: 'weight' as const, addedG: b.addedG!, startG: b.startG ?? 0 }
    return { designation: b.designation, volumeL: b.volumeL, ambientC: b.ambientC, targetChargeG: b.targetChargeG, reading, ...context }
  })
