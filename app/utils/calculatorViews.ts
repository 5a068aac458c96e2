/**
 * What the calculator cards show, computed in the browser from typed text with the shared property
 * module (no round trip). Pure functions, so they are unit-tested without a page.
 */
import { StandingPressureBodySchema } from '#shared/schemas/properties'
import type { StandingFromChargeDto, StandingFromPressureDto, StandingShiftDto } from '#shared/types/properties-dto'
import { saturationAtPressure, saturationAtTemperature, standingCheck } from '#shared/utils/calculator'
import { siteAtmosphere } from '#shared/utils/format'
import { OutOfRangeError, UnitError, UnknownRefrigerantError, toCelsius, toKpaAbs, type PressureUnit, type RefrigerantInfo, type TemperatureUnit } from '#shared/utils/properties'
import { parseDecimal } from './decimal'

/** One saturation state: a pure fluid has one, a blend a bubble (liquid) and a dew (vapour) state. */
export interface SaturationRow {
  label: string
  temperatureC: number
  pressureKpa: number
}

export type SaturationView =
  | { state: 'empty' }
  | { state: 'invalid'; message: string }
  | { state: 'ok'; inputKpa?: number; rows: SaturationRow[]; glideK?: number }

/** Property errors are the user's input being out of range (or naming no known refrigerant): their message; anything else is rethrown. */
export function propertyProblem(error: unknown): string {
  if (error instanceof OutOfRangeError || error instanceof UnitError || error instanceof UnknownRefrigerantError) return error.message
  throw error
}

const asInvalid = (error: unknown): { state: 'invalid'; message: string } => ({ state: 'invalid', message: propertyProblem(error) })

/** Saturation pressure(s) for a typed temperature. */
export function pressureFromTemperature(info: RefrigerantInfo, text: string, unit: TemperatureUnit): SaturationView {
  const typed = parseDecimal(text)
  if (typed.state !== 'ok') return typed
  try {
    const c = toCelsius(typed.value, unit)
    const s = saturationAtTemperature(info, c)
    const rows = 'pressureKpa' in s
      ? [{ label: 'Saturation pressure', temperatureC: c, pressureKpa: s.pressureKpa }]
      : [{ label: 'Bubble (liquid)', temperatureC: c, pressureKpa: s.bubblePressureKpa }, { label: 'Dew (vapour)', temperatureC: c, pressureKpa: s.dewPressureKpa }]
    return { state: 'ok', rows }
  } catch (error) {
    return asInvalid(error)
  }
}

/** Saturation temperature(s) for a typed pressure; gauge units use the local atmosphere. */
export function temperatureFromPressure(info: RefrigerantInfo, text: string, unit: PressureUnit, atmosphereKpa: number): SaturationView {
  const typed = parseDecimal(text)
  if (typed.state !== 'ok') return typed
  try {
    const kpa = toKpaAbs(typed.value, unit, atmosphereKpa)
    const s = saturationAtPressure(info, kpa)
    if ('temperatureC' in s) return { state: 'ok', inputKpa: kpa, rows: [{ label: 'Saturation temperature', temperatureC: s.temperatureC, pressureKpa: kpa }] }
    const rows = [{ label: 'Bubble (liquid)', temperatureC: s.bubbleTemperatureC, pressureKpa: kpa }, { label: 'Dew (vapour)', temperatureC: s.dewTemperatureC, pressureKpa: kpa }]
    return { state: 'ok', inputKpa: kpa, rows, glideK: s.glideK }
  } catch (error) {
    return asInvalid(error)
  }
}

export type StandingField = 'ambient' | 'charge' | 'volume' | 'measured'
export interface StandingForm {
  ambient: string
  charge: string
  volume: string
  measured: string
  measuredUnit: PressureUnit
}
export interface StandingView {
  errors: Partial<Record<StandingField, string>>
  expected?: StandingFromChargeDto
  /** The stage's recorded reference reading carried to this ambient along its isochore. */
  fromReference?: StandingShiftDto
  measured?: StandingFromPressureDto & { percentOfNameplate?: number }
  /** A state the property model refuses (e.g. ambient outside its range), in the model's words. */
  problem?: string
}

const FIELD_OF: Record<string, StandingField> = { ambientC: 'ambient', chargeG: 'charge', volumeL: 'volume', pressureKpa: 'measured' }

function numbers(form: StandingForm, atmosphereKpa: number, errors: StandingView['errors']) {
  const read = (field: StandingField, text: string): number | undefined => {
    const typed = parseDecimal(text)
    if (typed.state === 'invalid') errors[field] = typed.message
    return typed.state === 'ok' ? typed.value : undefined
  }
  const measured = read('measured', form.measured)
  let pressureKpa: number | undefined
  try {
    pressureKpa = measured === undefined ? undefined : toKpaAbs(measured, form.measuredUnit, atmosphereKpa)
  } catch (error) {
    errors.measured = asInvalid(error).message
  }
  return { ambientC: read('ambient', form.ambient), chargeG: read('charge', form.charge), volumeL: read('volume', form.volume), pressureKpa }
}

/**
 * The standing-pressure check: expected pressure from the nameplate charge (and from a recorded reference
 * reading, when the stage has one), and the charge a measured pressure implies.
 */
export function standingView(info: RefrigerantInfo, form: StandingForm, atmosphereKpa: number, reference?: { pressureKpa: number; ambientC: number }, designPressureKpa?: number): StandingView {
  const errors: StandingView['errors'] = {}
  const n = numbers(form, atmosphereKpa, errors)
  const view: StandingView = { errors }
  // The stage's design pressure, when known, goes with every check so its warnings compare against it.
  const design = designPressureKpa !== undefined ? { designPressureKpa } : {}
  const run = (body: Record<string, number | string | undefined>) => {
    const parsed = StandingPressureBodySchema.safeParse({ ...body, ...design })
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = FIELD_OF[String(issue.path[0])]
        if (field && body[String(issue.path[0])] !== undefined) errors[field] ??= issue.message
      }
      return undefined
    }
    try {
      return standingCheck(info, parsed.data)
    } catch (error) {
      view.problem = asInvalid(error).message
      return undefined
    }
  }
  if (n.ambientC === undefined) return view
  if (reference) {
    const shifted = run({ designation: info.designation, ambientC: n.ambientC, referencePressureKpa: reference.pressureKpa, referenceAmbientC: reference.ambientC })
    if (shifted?.mode === 'shift') view.fromReference = shifted
  }
  if (n.volumeL === undefined) return view
  const base = { designation: info.designation, ambientC: n.ambientC, volumeL: n.volumeL }
  if (n.chargeG !== undefined) {
    const expected = run({ ...base, chargeG: n.chargeG })
    if (expected?.mode === 'charge') view.expected = expected
  }
  if (n.pressureKpa !== undefined && !view.problem) {
    const measured = run({ ...base, pressureKpa: n.pressureKpa })
    if (measured?.mode === 'pressure') {
      const percent = n.chargeG ? (measured.chargeG / n.chargeG) * 100 : undefined
      view.measured = { ...measured, ...(percent !== undefined ? { percentOfNameplate: percent } : {}) }
    }
  }
  return view
}

/** Local atmospheric pressure for gauge readings: the ISO 2533 standard atmosphere at the site's altitude, else sea level. */
export function localAtmosphere(site?: { altitudeM: number; name: string }): { kpa: number; source: string } {
  const atmosphere = siteAtmosphere(site?.altitudeM)
  if (!site) return { kpa: atmosphere.kpa, source: atmosphere.source }
  return {
    kpa: atmosphere.kpa,
    source: atmosphere.fromAltitude
      ? `standard atmosphere at ${site.name}, ${site.altitudeM} m`
      : `sea level: ${site.name}'s altitude (${site.altitudeM} m) is outside the standard atmosphere`,
  }
}
