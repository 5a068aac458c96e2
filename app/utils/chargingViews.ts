/**
 * What the calculator's charge-planning cards show, computed in the browser from typed text with the same
 * shared modules the API runs (no round trip). Pure functions, unit-tested without a page.
 */
import type { ZodType } from 'zod'
import { ChargingBodySchema, SubstitutionBodySchema } from '#shared/schemas/charging'
import type { ChargingDto, SubstitutionDto } from '#shared/types/charging-dto'
import type { UnitStageDto } from '#shared/types/equipment-dto'
import type { Stage } from '#shared/types/diagnosis'
import { StandingReferenceSchema, type NameplateRefillInput } from '#shared/schemas/equipment'
import { chargingCheck, substitutionPlan } from '#shared/utils/calculator'
import type { SubstitutionBasis } from '#shared/utils/charging'
import { formatPressure, formatQuantity } from '#shared/utils/format'
import { PRESSURE_UNITS, findRefrigerant, standingPressureFromCharge, toKpaAbs, type Designation, type PressureUnit } from '#shared/utils/properties'
import { SUBSTITUTION_BASIS_WORDS } from '#shared/utils/vocabulary'
import { propertyProblem } from './calculatorViews'
import { parseDecimal } from './decimal'

/** A card's answer: field errors beside the inputs, the result once it computes, or the models' refusal in their words. */
export interface FormView<F extends string, R> {
  errors: Partial<Record<F, string>>
  result?: R
  problem?: string
}

/** Reads typed numbers, noting bad ones in `errors`; undefined for an empty or invalid field. */
function reader<F extends string>(errors: Partial<Record<F, string>>) {
  return (field: F, text: string): number | undefined => {
    const typed = parseDecimal(text)
    if (typed.state === 'invalid') errors[field] = typed.message
    return typed.state === 'ok' ? typed.value : undefined
  }
}

/**
 * Checks `body` with the route's own schema (issues go beside the fields `fieldOf` names) and computes the
 * answer; property errors become the view's problem.
 */
function checkedView<F extends string, T, R>(errors: Partial<Record<F, string>>, schema: ZodType<T>, body: unknown, fieldOf: Record<string, F>, compute: (input: T) => R): FormView<F, R> {
  const parsed = schema.safeParse(body)
  if (!parsed.success) {
    let unplaced: string | undefined
    for (const issue of parsed.error.issues) {
      const field = fieldOf[issue.path.map(String).join('.')]
      if (field) errors[field] ??= issue.message
      else unplaced ??= issue.message
    }
    return unplaced ? { errors, problem: unplaced } : { errors }
  }
  try {
    return { errors, result: compute(parsed.data) }
  } catch (error) {
    return { errors, problem: propertyProblem(error) }
  }
}

/** What a picked unit stage brings to a card: its refrigerant (when known), nameplate charge and volume as typed text. */
export function stageFields(stage: UnitStageDto): { designation?: Designation; chargeG: string; volumeL: string } {
  const known = findRefrigerant(stage.refrigerant)
  return {
    ...(known ? { designation: known.designation } : {}),
    chargeG: stage.chargeG !== null ? String(stage.chargeG) : '',
    volumeL: stage.volumeL !== null ? String(stage.volumeL) : '',
  }
}

export interface SubstitutionForm {
  from: Designation
  chargeG: string
  volumeL: string
  ambientC: string
  to: Designation
  basis: SubstitutionBasis
  evaporatingC: string
  condensingC: string
  designPressure: string
  designUnit: PressureUnit
  /** The unit of the technician's gauge, for the reading to charge to. */
  displayUnit: PressureUnit
}
export type SubstitutionField = 'chargeG' | 'volumeL' | 'ambientC' | 'evaporatingC' | 'condensingC' | 'designPressure'
export type SubstitutionView = FormView<SubstitutionField, SubstitutionDto>

const SUBSTITUTION_FIELDS: Record<string, SubstitutionField> = {
  'from.chargeG': 'chargeG', volumeL: 'volumeL', ambientC: 'ambientC', evaporatingC: 'evaporatingC', condensingC: 'condensingC', designPressureKpa: 'designPressure',
}

/** The three-basis plan for the typed stage, once the nameplate charge, volume and ambient are there. */
export function substitutionView(form: SubstitutionForm, atmosphereKpa: number): SubstitutionView {
  const errors: SubstitutionView['errors'] = {}
  const read = reader(errors)
  const n = {
    chargeG: read('chargeG', form.chargeG), volumeL: read('volumeL', form.volumeL), ambientC: read('ambientC', form.ambientC),
    evaporatingC: read('evaporatingC', form.evaporatingC), condensingC: read('condensingC', form.condensingC), design: read('designPressure', form.designPressure),
  }
  let designPressureKpa: number | undefined
  try {
    designPressureKpa = n.design === undefined ? undefined : toKpaAbs(n.design, form.designUnit, atmosphereKpa)
  } catch (error) {
    errors.designPressure = propertyProblem(error)
  }
  if (n.chargeG === undefined || n.volumeL === undefined || n.ambientC === undefined) return { errors }
  const body = {
    volumeL: n.volumeL, ambientC: n.ambientC, from: { designation: form.from, chargeG: n.chargeG }, to: form.to, basis: form.basis,
    evaporatingC: n.evaporatingC, condensingC: n.condensingC, designPressureKpa, unit: form.displayUnit, atmosphericKpa: atmosphereKpa,
  }
  return checkedView(errors, SubstitutionBodySchema, body, SUBSTITUTION_FIELDS, substitutionPlan)
}

/** The design pressure a picked stage brings to the planner, in absolute kPa as the nameplate record keeps it (empty when unknown). */
export function designPressureFields(stage: Pick<UnitStageDto, 'designPressureKpa'>): { designPressure: string; designUnit: PressureUnit } | Record<string, never> {
  return stage.designPressureKpa !== null ? { designPressure: String(Math.round(stage.designPressureKpa * 10) / 10), designUnit: 'kPa' } : {}
}

/**
 * Where a stage's nameplate charge stands at the room temperature read, from its current record (so a
 * stage just refilled with another refrigerant shows its new fill), and whether a gauge can show that
 * charge at all (not when it is partly liquid there). Undefined when the record lacks the figures.
 */
export function nameplateStanding(stage: Pick<UnitStageDto, 'refrigerant' | 'chargeG' | 'volumeL'>, ambientC: number | undefined): { pressureKpa: number; measurable: boolean } | undefined {
  const info = findRefrigerant(stage.refrigerant)
  if (!info || ambientC === undefined || !stage.chargeG || !stage.volumeL) return undefined
  try {
    const r = standingPressureFromCharge({ designation: info.designation, ambientC, volumeL: stage.volumeL, chargeG: stage.chargeG })
    return { pressureKpa: r.pressureKpa, measurable: r.phase === 'gas' || r.phase === 'supercritical' }
  } catch (error) {
    propertyProblem(error)
    return undefined
  }
}

/** What a page opened from a case brings to the calculator's cards: the room temperature read and the gauge unit in use. */
export interface Prefill { ambientC?: string; unit?: PressureUnit }

/** Reads the calculator's query (`ambientC=21.5&gauge=psig`) into a prefill; anything malformed is left out. */
export function prefillFromQuery(query: Record<string, unknown>): Prefill {
  const out: Prefill = {}
  const ambient = typeof query.ambientC === 'string' ? parseDecimal(query.ambientC) : undefined
  if (ambient?.state === 'ok' && ambient.value >= -60 && ambient.value <= 70) out.ambientC = String(ambient.value)
  if (typeof query.gauge === 'string' && (PRESSURE_UNITS as readonly string[]).includes(query.gauge)) out.unit = query.gauge as PressureUnit
  return out
}

/** Where a chosen plan is saved: a unit's stage, and the case it was planned in when there is one. */
export interface PlanSaveTarget { unitId: number; unitName: string; stage: Stage; caseId?: number }

/**
 * The body of `POST /api/units/{id}/nameplate` that keeps a chosen plan as the stage's new fill: its
 * figures in words in the note, and, when its standing pressure measures the charge, that pressure and
 * its ambient as figures, which become the stage's reference standing pressure.
 */
export function planRecordBody(plan: SubstitutionDto, target: PlanSaveTarget, ownNote: string): NameplateRefillInput {
  const grams = formatQuantity(plan.chargeG, 'g', 0)
  const chargeTo = plan.chargeTo
    ? `charge to ${plan.chargeTo.text} (${formatPressure(plan.standingPressureKpa, { decimals: 1 })}) at ${formatQuantity(plan.ambientC, 'C', 1)} room`
    : 'weigh it in: its standing pressure cannot measure it'
  const figures = `${SUBSTITUTION_BASIS_WORDS[plan.basis]} plan for ${plan.volumeL} L: ${grams} of ${plan.to.designation} for the nameplate ${formatQuantity(plan.from.chargeG, 'g', 0)} of ${plan.from.designation}; ${chargeTo}.`
  const note = [figures, ownNote.trim()].filter(Boolean).join(' ').slice(0, 2000)
  // Within the range a stage's reference may take (the route's own schema judges it).
  const reference = StandingReferenceSchema.safeParse({ standingPressureKpa: Math.round(plan.standingPressureKpa * 10) / 10, ambientC: plan.ambientC })
  const standing = plan.chargeTo && reference.success ? reference.data : {}
  return {
    stage: target.stage, refrigerant: plan.to.designation, chargeG: Math.round(plan.chargeG * 10) / 10, basis: plan.basis, note,
    ...standing,
    ...(target.caseId !== undefined ? { caseId: target.caseId } : {}),
  }
}

/** A planned charge handed from the substitution planner to the charging card. */
export interface ChargeTarget { designation: Designation; chargeG: number; volumeL: number; ambientC: number; unit: PressureUnit }

export interface ChargingForm {
  designation: Designation
  targetG: string
  volumeL: string
  ambientC: string
  by: 'pressure' | 'weight'
  pressure: string
  pressureUnit: PressureUnit
  addedG: string
  startG: string
  /** The picked stage's design pressure (absolute kPa), so the warnings compare against it. */
  designPressureKpa?: number
}
export type ChargingField = 'targetG' | 'volumeL' | 'ambientC' | 'pressure' | 'addedG' | 'startG'
export type ChargingView = FormView<ChargingField, ChargingDto>

const CHARGING_FIELDS: Record<string, ChargingField> = {
  targetChargeG: 'targetG', volumeL: 'volumeL', ambientC: 'ambientC', pressure: 'pressure', addedG: 'addedG', startG: 'startG', unit: 'pressure',
}

/** Grams now, to go and % of target from a standing-pressure reading, or the pressure to expect from weighed grams. */
export function chargingView(form: ChargingForm, atmosphereKpa: number): ChargingView {
  const errors: ChargingView['errors'] = {}
  const read = reader(errors)
  const n = {
    targetG: read('targetG', form.targetG), volumeL: read('volumeL', form.volumeL), ambientC: read('ambientC', form.ambientC),
    pressure: read('pressure', form.pressure), addedG: read('addedG', form.addedG), startG: read('startG', form.startG),
  }
  const reading = form.by === 'pressure' ? n.pressure : n.addedG
  if (n.targetG === undefined || n.volumeL === undefined || n.ambientC === undefined || reading === undefined) return { errors }
  const body = {
    designation: form.designation, targetChargeG: n.targetG, volumeL: n.volumeL, ambientC: n.ambientC,
    ...(form.by === 'pressure' ? { pressure: n.pressure } : { addedG: n.addedG, startG: n.startG ?? 0 }),
    unit: form.pressureUnit, atmosphericKpa: atmosphereKpa,
    ...(form.designPressureKpa !== undefined ? { designPressureKpa: form.designPressureKpa } : {}),
  }
  return checkedView(errors, ChargingBodySchema, body, CHARGING_FIELDS, chargingCheck)
}
