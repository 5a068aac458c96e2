/**
 * Inputs of the refrigerant-property routes. The calculator page checks its standing-pressure form with
 * the same body schema, so a field error reads the same in the browser and from the API.
 * Every pressure may come as absolute kPa (`pressureKpa`) or as typed on a gauge (`pressure` with `unit`);
 * gauge units read against `atmosphericKpa`, or the standard atmosphere at `altitudeM`, else at sea level.
 */
import { z } from 'zod'
import {
  ALL_PRESSURE_UNITS, STANDARD_ATMOSPHERE_KPA, TEMPERATURE_UNITS, atmosphericPressureAtAltitude, isPressureUnit,
  type AnyPressureUnit, type TemperatureUnit,
} from '#shared/utils/properties'

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

const UNITS = [...ALL_PRESSURE_UNITS, ...TEMPERATURE_UNITS] as const
const isTemperatureUnit = (u: string): u is TemperatureUnit => (TEMPERATURE_UNITS as readonly string[]).includes(u)

const ATMOSPHERE_MIN = 'atmosphericKpa must be at least 1 kPa'
const ATMOSPHERE_MAX = 'atmosphericKpa must be at most 120 kPa'
const ALTITUDE_MIN = 'altitudeM must be at least −500 m'
const ALTITUDE_MAX = 'altitudeM must be at most 11 000 m'

/** A pressure as typed on a gauge: the value, its unit and the atmosphere gauge units are read against. */
export interface TypedPressure { value: number; unit: AnyPressureUnit; atmosphericKpa: number }
/** A pressure given as absolute kPa, or as typed (converted later, so a reading below vacuum is a 422). */
export type PressureGiven = { kpa: number } | TypedPressure

/** The local atmosphere for gauge readings: given, from the site's altitude (ISO 2533), or sea level. */
export function atmosphereOf(b: { atmosphericKpa?: number | undefined; altitudeM?: number | undefined }): number {
  if (b.atmosphericKpa !== undefined) return b.atmosphericKpa
  return b.altitudeM !== undefined ? atmosphericPressureAtAltitude(b.altitudeM) : STANDARD_ATMOSPHERE_KPA
}

/** What a saturation look-up starts from, after the query is checked. */
export type SaturationQuery =
  | { by: 'temperature'; temperatureC: number }
  | { by: 'pressure'; pressureKpa: number }
  | { by: 'temperature'; value: number; unit: TemperatureUnit }
  | { by: 'pressure'; value: number; unit: AnyPressureUnit; atmosphericKpa?: number; altitudeM?: number }

const ONE_OF = 'Give exactly one of temperatureC, pressureKpa, or temperature/pressure with a unit'

/**
 * `?temperatureC=` or `?pressureKpa=` (absolute), exactly one; or `?pressure=15&unit=psig` (gauge units use
 * `atmosphericKpa` or `altitudeM`, default 101.325 kPa) / `?temperature=-112&unit=F`.
 */
export const SaturationQuerySchema = z
  .object({
    temperatureC: queryNumber('temperatureC').optional(),
    pressureKpa: queryNumber('pressureKpa').optional(),
    temperature: queryNumber('temperature').optional(),
    pressure: queryNumber('pressure').optional(),
    unit: z.enum(UNITS, { error: `unit must be one of: ${UNITS.join(', ')}` }).optional(),
    atmosphericKpa: queryNumber('atmosphericKpa').pipe(z.number().min(1, ATMOSPHERE_MIN).max(120, ATMOSPHERE_MAX)).optional(),
    altitudeM: queryNumber('altitudeM').pipe(z.number().min(-500, ALTITUDE_MIN).max(11_000, ALTITUDE_MAX)).optional(),
  })
  .transform((q, ctx): SaturationQuery => {
    const given = (['temperatureC', 'pressureKpa', 'temperature', 'pressure'] as const).filter((k) => q[k] !== undefined)
    if (given.length !== 1) {
      for (const path of given.length ? given : (['temperatureC', 'pressureKpa'] as const)) ctx.addIssue({ code: 'custom', message: ONE_OF, path: [path] })
      return z.NEVER
    }
    if (q.atmosphericKpa !== undefined && q.altitudeM !== undefined) {
      ctx.addIssue({ code: 'custom', message: 'Give atmosphericKpa or altitudeM, not both', path: ['altitudeM'] })
      return z.NEVER
    }
    if (q.temperatureC !== undefined) return { by: 'temperature', temperatureC: q.temperatureC }
    if (q.pressureKpa !== undefined) return { by: 'pressure', pressureKpa: q.pressureKpa }
    if (q.temperature !== undefined && q.unit && isTemperatureUnit(q.unit)) return { by: 'temperature', value: q.temperature, unit: q.unit }
    if (q.pressure !== undefined && q.unit && isPressureUnit(q.unit)) {
      return {
        by: 'pressure', value: q.pressure, unit: q.unit,
        ...(q.atmosphericKpa !== undefined ? { atmosphericKpa: q.atmosphericKpa } : {}),
        ...(q.altitudeM !== undefined ? { altitudeM: q.altitudeM } : {}),
      }
    }
    const allowed = q.temperature !== undefined ? TEMPERATURE_UNITS : ALL_PRESSURE_UNITS
    ctx.addIssue({ code: 'custom', message: `unit must be one of: ${allowed.join(', ')}`, path: ['unit'] })
    return z.NEVER
  })

const bodyNumber = (label: string) => z.number({ error: `${label} must be a number` })

/** Body fields shared by every route that takes pressures: the gauge unit and the local atmosphere. */
export const pressureContextFields = {
  unit: z.enum(ALL_PRESSURE_UNITS, { error: `unit must be one of: ${ALL_PRESSURE_UNITS.join(', ')}` }).optional(),
  altitudeM: bodyNumber('altitudeM').min(-500, ALTITUDE_MIN).max(11_000, ALTITUDE_MAX).optional(),
  atmosphericKpa: bodyNumber('atmosphericKpa').min(1, ATMOSPHERE_MIN).max(120, ATMOSPHERE_MAX).optional(),
  designPressureKpa: bodyNumber('designPressureKpa (kPa, absolute)').positive('The design pressure must be above 0 kPa absolute').max(1_000_000, 'The design pressure must be at most 1 000 000 kPa').optional(),
  designPressure: bodyNumber('designPressure').min(-1_000_000, 'designPressure must be at least −1 000 000').max(1_000_000, 'designPressure must be at most 1 000 000').optional(),
}

interface PressureContextBody {
  unit?: AnyPressureUnit | undefined
  altitudeM?: number | undefined
  atmosphericKpa?: number | undefined
  designPressureKpa?: number | undefined
  designPressure?: number | undefined
}

/** The display unit and atmosphere of a body, plus its design pressure; issues are added to `ctx` on conflicts. */
export function pressureContext(b: PressureContextBody, ctx: z.RefinementCtx): { display: { unit: AnyPressureUnit; atmosphericKpa: number }; designPressure?: PressureGiven } | undefined {
  let ok = true
  if (b.atmosphericKpa !== undefined && b.altitudeM !== undefined) {
    ctx.addIssue({ code: 'custom', message: 'Give atmosphericKpa or altitudeM, not both', path: ['altitudeM'] })
    ok = false
  }
  const designPressure = given(b, 'designPressure', 'designPressureKpa', ctx)
  if (designPressure === null) ok = false
  if (!ok) return undefined
  const atmosphericKpa = atmosphereOf(b)
  return { display: { unit: b.unit ?? 'kPag', atmosphericKpa }, ...(designPressure ? { designPressure } : {}) }
}

/**
 * One pressure given either as `<kpaKey>` (absolute kPa) or as `<valueKey>` with the body's `unit`.
 * Returns undefined when neither is there, null (with issues added) when the pair is inconsistent.
 */
export function given<K extends string, A extends string>(
  b: { [k in K | A]?: number | undefined } & { unit?: AnyPressureUnit | undefined; atmosphericKpa?: number | undefined; altitudeM?: number | undefined },
  valueKey: K, kpaKey: A, ctx: z.RefinementCtx,
): PressureGiven | undefined | null {
  const value = b[valueKey], kpa = b[kpaKey]
  if (value !== undefined && kpa !== undefined) {
    ctx.addIssue({ code: 'custom', message: `Give ${kpaKey} (absolute) or ${valueKey} with a unit, not both`, path: [valueKey] })
    return null
  }
  if (kpa !== undefined) return { kpa }
  if (value === undefined) return undefined
  if (!b.unit) {
    ctx.addIssue({ code: 'custom', message: `Give the unit of ${valueKey}: one of ${ALL_PRESSURE_UNITS.join(', ')}`, path: ['unit'] })
    return null
  }
  return { value, unit: b.unit, atmosphericKpa: atmosphereOf(b) }
}

/** What a standing-pressure calculation starts from, after the body is checked. */
export type StandingRequest = {
  designation: string
  ambientC: number
  display: { unit: AnyPressureUnit; atmosphericKpa: number }
  designPressure?: PressureGiven
} & (
  | { mode: 'charge'; volumeL: number; chargeG: number }
  | { mode: 'pressure'; volumeL: number; pressure: PressureGiven }
  | { mode: 'shift'; referencePressureKpa: number; referenceAmbientC: number; volumeL?: number }
)

const MODES = 'Give exactly one of chargeG, pressureKpa (or pressure with a unit), or referencePressureKpa with referenceAmbientC'

/**
 * `POST /api/calculations/standing-pressure`: a stage switched off and equalised at `ambientC`, with
 * exactly one of a charge (g), a measured pressure (absolute kPa, or `pressure` + `unit`), or a reference
 * reading to shift; optionally the stage's design pressure to check against.
 */
export const StandingPressureBodySchema = z
  .object({
    designation: z.string({ error: 'Give the refrigerant designation, e.g. R170' }).trim().min(1, 'Give the refrigerant designation, e.g. R170').max(20),
    ambientC: bodyNumber('Ambient temperature (°C)'),
    volumeL: bodyNumber('Internal volume (L)').positive('Internal volume must be above 0 L').max(100_000, 'Internal volume must be at most 100 000 L').optional(),
    chargeG: bodyNumber('Charge (g)').nonnegative('Charge cannot be negative').max(10_000_000, 'Charge must be at most 10 000 000 g').optional(),
    pressureKpa: bodyNumber('Standing pressure (kPa, absolute)').positive('Absolute pressure must be above 0 kPa (gauge readings: send pressure with a unit such as psig)').optional(),
    pressure: bodyNumber('Standing pressure').optional(),
    referencePressureKpa: bodyNumber('Reference pressure (kPa, absolute)').positive('Absolute pressure must be above 0 kPa').optional(),
    referenceAmbientC: bodyNumber('Reference ambient (°C)').optional(),
    ...pressureContextFields,
  })
  .transform((b, ctx): StandingRequest => {
    const { designation, ambientC, volumeL } = b
    const context = pressureContext(b, ctx)
    const measured = given(b, 'pressure', 'pressureKpa', ctx)
    if (!context || measured === null) return z.NEVER
    const reference = b.referencePressureKpa !== undefined || b.referenceAmbientC !== undefined
    const modes = [b.chargeG !== undefined, measured !== undefined, reference].filter(Boolean).length
    if (modes !== 1) {
      const present = (['chargeG', 'pressureKpa', 'pressure', 'referencePressureKpa', 'referenceAmbientC'] as const).filter((k) => b[k] !== undefined)
      for (const path of modes === 0 ? (['chargeG', 'pressureKpa'] as const) : present) ctx.addIssue({ code: 'custom', message: MODES, path: [path] })
      return z.NEVER
    }
    const common = { designation, ambientC, ...context }
    if (b.chargeG !== undefined && volumeL !== undefined) return { ...common, mode: 'charge', volumeL, chargeG: b.chargeG }
    if (measured !== undefined && volumeL !== undefined) return { ...common, mode: 'pressure', volumeL, pressure: measured }
    if (!reference) {
      ctx.addIssue({ code: 'custom', message: 'Give the internal volume (L) of the stage', path: ['volumeL'] })
      return z.NEVER
    }
    if (b.referencePressureKpa === undefined || b.referenceAmbientC === undefined) {
      const missing = b.referencePressureKpa === undefined ? 'referencePressureKpa' : 'referenceAmbientC'
      ctx.addIssue({ code: 'custom', message: 'A reference reading needs both referencePressureKpa and referenceAmbientC', path: [missing] })
      return z.NEVER
    }
    return { ...common, mode: 'shift', referencePressureKpa: b.referencePressureKpa, referenceAmbientC: b.referenceAmbientC, ...(volumeL !== undefined ? { volumeL } : {}) }
  })

/** `GET /api/conversions/measurement?value=15&from=psig&to=kPa` (also at its first address /api/units-conversion; gauge units use `atmosphericKpa` or `altitudeM`, else 101.325 kPa). */
export const MeasurementConversionQuerySchema = z
  .object({
    value: queryNumber('value'),
    from: z.enum(UNITS, { error: `from must be one of: ${UNITS.join(', ')}` }),
    to: z.enum(UNITS, { error: `to must be one of: ${UNITS.join(', ')}` }),
    atmosphericKpa: queryNumber('atmosphericKpa').pipe(z.number().min(1, ATMOSPHERE_MIN).max(120, ATMOSPHERE_MAX)).optional(),
    altitudeM: queryNumber('altitudeM').pipe(z.number().min(-500, ALTITUDE_MIN).max(11_000, ALTITUDE_MAX)).optional(),
  })
  .superRefine((q, ctx) => {
    if (isPressureUnit(q.from) !== isPressureUnit(q.to)) ctx.addIssue({ code: 'custom', message: `Cannot convert ${q.from} to ${q.to}: one is a pressure, the other a temperature`, path: ['to'] })
    if (q.atmosphericKpa !== undefined && q.altitudeM !== undefined) ctx.addIssue({ code: 'custom', message: 'Give atmosphericKpa or altitudeM, not both', path: ['altitudeM'] })
  })
export type MeasurementConversionQuery = z.infer<typeof MeasurementConversionQuerySchema>
