/**
 * Inputs of the refrigerant-property routes. The calculator page checks its standing-pressure form with
 * the same body schema, so a field error reads the same in the browser and from the API.
 */
import { z } from 'zod'
import { PRESSURE_UNITS, TEMPERATURE_UNITS, type PressureUnit, type TemperatureUnit } from '#shared/utils/properties'

/** `{designation}` in a route; whether it is known is decided later (404, not 400). */
export const DesignationParamsSchema = z.object({
  designation: z.string().trim().min(1, 'Give a refrigerant designation, e.g. R170').max(20, 'Designation too long'),
})

// Query values arrive as strings. An empty string must not become 0 (Number('') === 0), and a repeated
// parameter arrives as an array: both are left alone so z.number() refuses them.
const queryNumber = (label: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' && v.trim() !== '' ? Number(v.trim()) : v),
    z.number({ error: `${label} must be a number` }),
  )

const UNITS = [...PRESSURE_UNITS, ...TEMPERATURE_UNITS] as const
const isPressureUnit = (u: string): u is PressureUnit => (PRESSURE_UNITS as readonly string[]).includes(u)
const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)

/** What a saturation look-up starts from, after the query is checked. */
export type SaturationQuery =
  | { by: 'temperature'; temperatureC: number }
  | { by: 'pressure'; pressureKpa: number }
  | { by: 'temperature'; value: number; unit: TemperatureUnit }
  | { by: 'pressure'; value: number; unit: PressureUnit; atmosphericKpa?: number }

const ONE_OF = 'Give exactly one of temperatureC, pressureKpa, or temperature/pressure with a unit'

/**
 * `?temperatureC=` or `?pressureKpa=` (absolute), exactly one; or, as a convenience, `?pressure=15&unit=psig`
 * / `?temperature=-112&unit=F` (gauge units use `atmosphericKpa`, default 101.325 kPa).
 */
export const SaturationQuerySchema = z
  .object({
    temperatureC: queryNumber('temperatureC').optional(),
    pressureKpa: queryNumber('pressureKpa').optional(),
    temperature: queryNumber('temperature').optional(),
    pressure: queryNumber('pressure').optional(),
    unit: z.enum(UNITS, { error: `unit must be one of: ${UNITS.join(', ')}` }).optional(),
    atmosphericKpa: queryNumber('atmosphericKpa').pipe(z.number().min(1, 'atmosphericKpa must be at least 1 kPa').max(120, 'atmosphericKpa must be at most 120 kPa')).optional(),
  })
  .transform((q, ctx): SaturationQuery => {
    const given = (['temperatureC', 'pressureKpa', 'temperature', 'pressure'] as const).filter((k) => q[k] !== undefined)
    if (given.length !== 1) {
      for (const path of given.length ? given : (['temperatureC', 'pressureKpa'] as const)) ctx.addIssue({ code: 'custom', message: ONE_OF, path: [path] })
      return z.NEVER
    }
    if (q.temperatureC !== undefined) return { by: 'temperature', temperatureC: q.temperatureC }
    if (q.pressureKpa !== undefined) return { by: 'pressure', pressureKpa: q.pressureKpa }
    if (q.temperature !== undefined && q.unit && isTemperatureUnit(q.unit)) return { by: 'temperature', value: q.temperature, unit: q.unit }
    if (q.pressure !== undefined && q.unit && isPressureUnit(q.unit)) {
      return { by: 'pressure', value: q.pressure, unit: q.unit, ...(q.atmosphericKpa !== undefined ? { atmosphericKpa: q.atmosphericKpa } : {}) }
    }
    const allowed = q.temperature !== undefined ? TEMPERATURE_UNITS : PRESSURE_UNITS
    ctx.addIssue({ code: 'custom', message: `unit must be one of: ${allowed.join(', ')}`, path: ['unit'] })
    return z.NEVER
  })

const bodyNumber = (label: string) => z.number({ error: `${label} must be a number` })

/** What a standing-pressure calculation starts from, after the body is checked. */
export type StandingRequest =
  | { mode: 'charge'; designation: string; ambientC: number; volumeL: number; chargeG: number }
  | { mode: 'pressure'; designation: string; ambientC: number; volumeL: number; pressureKpa: number }
  | { mode: 'shift'; designation: string; ambientC: number; referencePressureKpa: number; referenceAmbientC: number; volumeL?: number }

const MODES = 'Give exactly one of chargeG, pressureKpa, or referencePressureKpa with referenceAmbientC'

/**
 * `POST /api/calculations/standing-pressure`: a stage switched off and equalised at `ambientC`, with
 * exactly one of a charge (g), a measured absolute pressure (kPa), or a reference reading to shift.
 */
export const StandingPressureBodySchema = z
  .object({
    designation: z.string({ error: 'Give the refrigerant designation, e.g. R170' }).trim().min(1, 'Give the refrigerant designation, e.g. R170').max(20),
    ambientC: bodyNumber('Ambient temperature (°C)'),
    volumeL: bodyNumber('Internal volume (L)').positive('Internal volume must be above 0 L').max(100_000, 'Internal volume must be at most 100 000 L').optional(),
    chargeG: bodyNumber('Charge (g)').nonnegative('Charge cannot be negative').max(10_000_000, 'Charge must be at most 10 000 000 g').optional(),
    pressureKpa: bodyNumber('Standing pressure (kPa, absolute)').positive('Absolute pressure must be above 0 kPa (gauge readings: add the atmospheric pressure)').optional(),
    referencePressureKpa: bodyNumber('Reference pressure (kPa, absolute)').positive('Absolute pressure must be above 0 kPa').optional(),
    referenceAmbientC: bodyNumber('Reference ambient (°C)').optional(),
  })
  .transform((b, ctx): StandingRequest => {
    const { designation, ambientC, volumeL } = b
    const reference = b.referencePressureKpa !== undefined || b.referenceAmbientC !== undefined
    const modes = [b.chargeG !== undefined, b.pressureKpa !== undefined, reference].filter(Boolean).length
    if (modes !== 1) {
      const given = (['chargeG', 'pressureKpa', 'referencePressureKpa', 'referenceAmbientC'] as const).filter((k) => b[k] !== undefined)
      for (const path of modes === 0 ? (['chargeG', 'pressureKpa'] as const) : given) ctx.addIssue({ code: 'custom', message: MODES, path: [path] })
      return z.NEVER
    }
    if (b.chargeG !== undefined && volumeL !== undefined) return { mode: 'charge', designation, ambientC, volumeL, chargeG: b.chargeG }
    if (b.pressureKpa !== undefined && volumeL !== undefined) return { mode: 'pressure', designation, ambientC, volumeL, pressureKpa: b.pressureKpa }
    if (!reference) {
      ctx.addIssue({ code: 'custom', message: 'Give the internal volume (L) of the stage', path: ['volumeL'] })
      return z.NEVER
    }
    if (b.referencePressureKpa === undefined || b.referenceAmbientC === undefined) {
      const missing = b.referencePressureKpa === undefined ? 'referencePressureKpa' : 'referenceAmbientC'
      ctx.addIssue({ code: 'custom', message: 'A reference reading needs both referencePressureKpa and referenceAmbientC', path: [missing] })
      return z.NEVER
    }
    return { mode: 'shift', designation, ambientC, referencePressureKpa: b.referencePressureKpa, referenceAmbientC: b.referenceAmbientC, ...(volumeL !== undefined ? { volumeL } : {}) }
  })

/** `GET /api/conversions/measurement?value=15&from=psig&to=kPa` (also at its first address /api/units-conversion; gauge units use `atmosphericKpa` or `altitudeM`, else 101.325 kPa). */
export const MeasurementConversionQuerySchema = z
  .object({
    value: queryNumber('value'),
    from: z.enum(UNITS, { error: `from must be one of: ${UNITS.join(', ')}` }),
    to: z.enum(UNITS, { error: `to must be one of: ${UNITS.join(', ')}` }),
    atmosphericKpa: queryNumber('atmosphericKpa').pipe(z.number().min(1, 'atmosphericKpa must be at least 1 kPa').max(120, 'atmosphericKpa must be at most 120 kPa')).optional(),
    altitudeM: queryNumber('altitudeM').pipe(z.number().min(-500, 'altitudeM must be at least −500 m').max(11_000, 'altitudeM must be at most 11 000 m')).optional(),
  })
  .superRefine((q, ctx) => {
    if (isPressureUnit(q.from) !== isPressureUnit(q.to)) ctx.addIssue({ code: 'custom', message: `Cannot convert ${q.from} to ${q.to}: one is a pressure, the other a temperature`, path: ['to'] })
    if (q.atmosphericKpa !== undefined && q.altitudeM !== undefined) ctx.addIssue({ code: 'custom', message: 'Give atmosphericKpa or altitudeM, not both', path: ['altitudeM'] })
  })
export type MeasurementConversionQuery = z.infer<typeof MeasurementConversionQuerySchema>
