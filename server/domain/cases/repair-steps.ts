// Repair and verification steps judged from their figures: a pressure hold corrected for the
// temperature change, an evacuation and its decay, the checklist before brazing, a recharge by
// weight or by standing pressure. Each step carries the cautions of its own kind, stage and
// refrigerant only. Pure: no I/O.
import type {
  EvacuationInput, HotWorkInput, PressureHoldInput, RechargeInput, RepairStepInput, RepairStepKind, RepairStepResult, StepFigure,
} from '#shared/types/repair-steps'
import { HOT_WORK_CHECKS } from '#shared/types/repair-steps'
export { requiredHotWorkChecks, stepCautions } from '#shared/utils/repair-steps'
import type { UnitStageDto } from '#shared/types/equipment-dto'
import { chargingProgress } from '#shared/utils/charging'
import { requiredHotWorkChecks, stepCautions } from '#shared/utils/repair-steps'
import { formatFigure, formatPressure, formatQuantity, formatDuration } from '#shared/utils/format'
import type { FieldErrors } from '#shared/utils/input-errors'
import { findRefrigerant, isDesignation, toCelsius, toKpaAbs, type Designation, type PressureUnit } from '#shared/utils/properties'
import { HOLD_GAS_WORDS, HOT_WORK_CHECK_WORDS, stageLabel } from '#shared/utils/vocabulary'
import { ImplausibleInputError } from '../errors'

const K0 = 273.15

/**
 * Allowed drop of a pressure hold after the temperature correction: the larger of 0.5 % of the
 * starting absolute pressure and 3.5 kPa (about half a psi), i.e. about one division of the gauges
 * used for such tests (common practice, no source). A drop within it is "no measurable loss".
 */
export const HOLD_TOLERANCE_FRACTION = 0.005
export const HOLD_TOLERANCE_MIN_KPA = 3.5
/** A hold shorter than this shows only gross leaks (common practice, no source). */
export const SHORT_HOLD_MINUTES = 15
/** A hold started more than 5 % under the test pressure did not test at that pressure (common practice, no source). */
const START_BELOW_TEST = 0.95

/** Evacuation: the vacuum after the decay time may rise to at most twice the target, and never above 1000 microns (common practice, no source). */
export const DECAY_LIMIT_MICRON = 1000
export const MICRON_KPA = 0.000133322387415 // 1 µmHg = 0.133 322 387 415 Pa (1 mmHg = 133.322 387 415 Pa)
const SHORT_DECAY_MINUTES = 10

/**
 * A closed volume of gas at constant volume and amount: p/T stays constant (ideal-gas law,
 * pV = nRT). The end pressure expected from the start pressure and the temperature change, and
 * the drop that is left once that change is taken out: what leaked. Absolute pressures, kelvin.
 */
export function temperatureCorrectedDrop(i: { startKpa: number; endKpa: number; startK: number; endK: number }): { expectedEndKpa: number; correctedDropKpa: number } {
  const expectedEndKpa = i.startKpa * (i.endK / i.startK)
  return { expectedEndKpa, correctedDropKpa: expectedEndKpa - i.endKpa }
}

/** The allowed drop of a hold that started at `startKpa` (absolute). */
export function holdToleranceKpa(startKpa: number): number {
  return Math.max(HOLD_TOLERANCE_FRACTION * startKpa, HOLD_TOLERANCE_MIN_KPA)
}

export interface StepContext {
  stage: Pick<UnitStageDto, 'stage' | 'refrigerant' | 'chargeG' | 'volumeL'> & { designPressureKpa?: number | null }
  atmosphericKpa: number
}

function refuse(fieldErrors: FieldErrors): never {
  const first = Object.values(fieldErrors)[0]?.[0] ?? 'This step cannot be recorded as entered.'
  const more = Object.keys(fieldErrors).length - 1
  throw new ImplausibleInputError(more > 0 ? `${first} (and ${more} more)` : first, fieldErrors)
}

/** Absolute kPa of a pressure as entered, or a field message when it cannot be a pressure. */
function absolute(value: number, unit: string, atmosphericKpa: number, field: string, errors: FieldErrors): number {
  try {
    const kpa = toKpaAbs(value, unit, atmosphericKpa)
    if (kpa < 0) (errors[field] ??= []).push(`${formatQuantity(value, unit)} is below a perfect vacuum; check the sign and the unit.`)
    return kpa
  } catch (error) {
    ;(errors[field] ??= []).push(error instanceof Error ? error.message : 'Not a pressure')
    return Number.NaN
  }
}

function kelvin(value: number, unit: string, field: string, errors: FieldErrors): number {
  try {
    return toCelsius(value, unit) + K0
  } catch (error) {
    ;(errors[field] ??= []).push(error instanceof Error ? error.message : 'Not a temperature')
    return Number.NaN
  }
}

function designationOf(ctx: StepContext, given?: string): Designation | undefined {
  const d = given ?? ctx.stage.refrigerant
  return isDesignation(d) ? d : undefined
}

function pressureHold(input: PressureHoldInput, ctx: StepContext): RepairStepResult {
  const errors: FieldErrors = {}
  const atm = ctx.atmosphericKpa
  const test = absolute(input.testPressure, input.pressureUnit, atm, 'testPressure', errors)
  const start = absolute(input.startPressure, input.pressureUnit, atm, 'startPressure', errors)
  const end = absolute(input.endPressure, input.pressureUnit, atm, 'endPressure', errors)
  const startK = kelvin(input.startTemperature, input.temperatureUnit, 'startTemperature', errors)
  const endK = kelvin(input.endTemperature, input.temperatureUnit, 'endTemperature', errors)
  if (Object.keys(errors).length) refuse(errors)
  if (test <= atm) refuse({ testPressure: ['A pressure hold tests above atmospheric pressure; enter the test pressure as read on the gauge.'] })

  const { expectedEndKpa, correctedDropKpa } = temperatureCorrectedDrop({ startKpa: start, endKpa: end, startK, endK })
  const tolerance = holdToleranceKpa(start)
  const shown = (kpa: number) => formatPressure(kpa, { unit: input.pressureUnit as PressureUnit, atmosphericKpa: atm })
  // A difference of two pressures is neither absolute nor gauge.
  const delta = (kpa: number) => `${formatFigure(kpa, 1)} kPa`
  const warnings: string[] = []
  if (start < test * START_BELOW_TEST) warnings.push(`The hold started at ${shown(start)}, below the test pressure of ${shown(test)}: it tested the stage at the lower pressure only.`)
  if (input.holdMinutes < SHORT_HOLD_MINUTES) warnings.push(`A hold of ${formatDuration(input.holdMinutes)} shows only large leaks; hold longer where the site's procedure asks for it.`)
  const design = ctx.stage.designPressureKpa ?? null
  if (design !== null && test > design) warnings.push(`The test pressure ${shown(test)} is above the stage's design pressure of ${shown(design)}.`)
  const pass = correctedDropKpa <= tolerance
  const rise = correctedDropKpa < -tolerance
  if (rise) warnings.push('The pressure rose more than the temperature change explains: check that the cylinder valve was closed and that both temperatures were read at the same place.')
  const figures: StepFigure[] = [
    { label: 'Test gas', value: HOLD_GAS_WORDS[input.gas] },
    { label: 'Test pressure', value: shown(test) },
    { label: 'Start', value: `${shown(start)} at ${formatQuantity(startK - K0, 'C', 1)}` },
    { label: 'End', value: `${shown(end)} at ${formatQuantity(endK - K0, 'C', 1)}` },
    { label: 'Hold time', value: formatDuration(input.holdMinutes) },
    { label: 'End pressure the temperature change explains (p/T constant)', value: shown(expectedEndKpa) },
    { label: 'Drop after temperature correction', value: `${delta(correctedDropKpa)} (allowed ${delta(tolerance)})` },
  ]
  const summary = pass
    ? correctedDropKpa <= 0
      ? `Held: no loss once the temperature change is taken out (${delta(correctedDropKpa)}, allowed ${delta(tolerance)}).`
      : `Held: ${delta(correctedDropKpa)} drop after correcting for the temperature change, within the ${delta(tolerance)} allowed.`
    : `Did not hold: ${delta(correctedDropKpa)} lost after correcting for the temperature change (allowed ${delta(tolerance)}). Search for the leak before going on.`
  return { verdict: pass ? 'pass' : 'fail', summary, figures, warnings, cautions: stepCautions('pressure-hold', ctx.stage.refrigerant) }
}

function evacuation(input: EvacuationInput, ctx: StepContext): RepairStepResult {
  const errors: FieldErrors = {}
  const atm = ctx.atmosphericKpa
  const target = absolute(input.target, input.vacuumUnit, atm, 'target', errors)
  const reached = absolute(input.reached, input.vacuumUnit, atm, 'reached', errors)
  const after = absolute(input.afterDecay, input.vacuumUnit, atm, 'afterDecay', errors)
  for (const [field, kpa] of [['target', target], ['reached', reached], ['afterDecay', after]] as const) {
    if (Number.isFinite(kpa) && kpa > atm) (errors[field] ??= []).push('A vacuum is below atmospheric pressure; check the unit and the figure.')
  }
  if (Object.keys(errors).length) refuse(errors)
  const micron = (kpa: number) => `${formatFigure(kpa / MICRON_KPA, 0)} microns`
  const asEntered = (kpa: number, raw: number) => (input.vacuumUnit === 'micron' ? micron(kpa) : `${formatQuantity(raw, input.vacuumUnit)} (${micron(kpa)})`)
  const limit = Math.min(Math.max(2 * target, target), DECAY_LIMIT_MICRON * MICRON_KPA)
  const reachedTarget = reached <= target * 1.0001
  const held = after <= Math.max(limit, reached)
  const warnings: string[] = []
  if (input.decayMinutes < SHORT_DECAY_MINUTES) warnings.push(`A decay of ${formatDuration(input.decayMinutes)} is short: a slow leak or moisture shows only over longer.`)
  if (reachedTarget && !held) warnings.push('The vacuum rose after the pump was isolated: a steady rise that does not level off points to a leak; a rise that levels off points to moisture still boiling off.')
  const figures: StepFigure[] = [
    { label: 'Target', value: asEntered(target, input.target) },
    { label: 'Reached', value: asEntered(reached, input.reached) },
    { label: `After ${formatDuration(input.decayMinutes)} isolated`, value: asEntered(after, input.afterDecay) },
    { label: 'Rise while isolated', value: micron(Math.max(after - reached, 0)) },
    { label: 'Allowed after the decay', value: micron(limit) },
  ]
  const verdict = !reachedTarget ? 'incomplete' : held ? 'pass' : 'fail'
  const summary = verdict === 'pass'
    ? `Evacuated to ${micron(reached)} and held at ${micron(after)} after ${formatDuration(input.decayMinutes)} isolated.`
    : verdict === 'incomplete'
      ? `Reached ${micron(reached)}, not the target of ${micron(target)}: go on evacuating before the decay test.`
      : `Rose to ${micron(after)} within ${formatDuration(input.decayMinutes)} (allowed ${micron(limit)}): find the leak or the moisture before charging.`
  return { verdict, summary, figures, warnings, cautions: stepCautions('evacuation', ctx.stage.refrigerant) }
}

function hotWork(input: HotWorkInput, ctx: StepContext): RepairStepResult {
  const required = requiredHotWorkChecks(ctx.stage.refrigerant)
  const missing = required.filter((c) => !input.checklist[c])
  if (missing.length) {
    const flammable = required.length === HOT_WORK_CHECKS.length
    refuse(Object.fromEntries(missing.map((c) => [
      `checklist.${c}`,
      [`${flammable ? `The ${stageLabel(ctx.stage.stage).toLowerCase()} held ${ctx.stage.refrigerant}, which is flammable. ` : ''}Before brazing: ${HOT_WORK_CHECK_WORDS[c].toLowerCase()}.`],
    ])))
  }
  const figures = HOT_WORK_CHECKS.filter((c) => input.checklist[c]).map((c) => ({ label: 'Checked', value: HOT_WORK_CHECK_WORDS[c] }))
  return {
    verdict: 'done',
    summary: `${input.task}: brazed after ${figures.length} of ${HOT_WORK_CHECKS.length} checks, all those required for ${ctx.stage.refrigerant} done.`,
    figures: [{ label: 'Work', value: input.task }, ...figures],
    warnings: [],
    cautions: stepCautions('hot-work', ctx.stage.refrigerant),
  }
}

function recharge(input: RechargeInput, ctx: StepContext): RepairStepResult {
  const refrigerant = input.refrigerant ?? ctx.stage.refrigerant
  const d = designationOf(ctx, refrigerant)
  if (!d) refuse({ refrigerant: [`${refrigerant} is not a refrigerant Rimecase knows`] })
  const target = input.targetGrams ?? (refrigerant === ctx.stage.refrigerant ? ctx.stage.chargeG : null) ?? undefined
  const cautions = stepCautions('recharge', d)
  const figures: StepFigure[] = [{ label: 'Refrigerant', value: d }]
  if (input.cylinder) figures.push({ label: 'Cylinder', value: input.cylinder })
  if (input.method === 'scale') return rechargeByScale(input, ctx, d, target, figures, cautions)
  const errors: FieldErrors = {}
  if (input.pressure === undefined || !input.pressureUnit) errors.pressure = ['Enter the standing pressure read after charging, and its unit']
  if (input.ambientC === undefined) errors.ambientC = ['Enter the room temperature the stage settled at']
  if (!ctx.stage.volumeL) errors.stage = ['The stage\'s internal volume is not on the unit\'s nameplate record; charge by weight, or add the volume to the unit first']
  if (!target) errors.targetGrams = ['Enter the charge the stage should hold']
  if (Object.keys(errors).length) refuse(errors)
  const kpa = absolute(input.pressure!, input.pressureUnit!, ctx.atmosphericKpa, 'pressure', errors)
  if (Object.keys(errors).length) refuse(errors)
  let progress: ReturnType<typeof chargingProgress>
  try {
    progress = chargingProgress(
      { designation: d, volumeL: ctx.stage.volumeL!, ambientC: input.ambientC!, targetChargeG: target!, display: { unit: input.pressureUnit!, atmosphericKpa: ctx.atmosphericKpa },
        ...(ctx.stage.designPressureKpa ? { designPressureKpa: ctx.stage.designPressureKpa } : {}) },
      { by: 'pressure', pressureKpa: kpa },
    )
  } catch (error) {
    refuse({ pressure: [error instanceof Error ? error.message : 'This standing pressure is outside what the refrigerant can be at'] })
  }
  const shown = (p: number) => formatPressure(p, { unit: input.pressureUnit as PressureUnit, atmosphericKpa: ctx.atmosphericKpa })
  figures.push(
    { label: 'Standing pressure read', value: `${shown(kpa)} at ${formatQuantity(input.ambientC!, 'C', 1)} room` },
    { label: 'Charge to (target at this room temperature)', value: progress.target.reading ? shown(progress.target.standingPressureKpa) : 'cannot be shown by pressure' },
    { label: progress.chargeIsMinimum ? 'Grams in the stage (at least)' : 'Grams in the stage', value: formatQuantity(progress.chargeNowG, 'g', 0) },
    { label: 'Target charge', value: formatQuantity(target!, 'g', 0) },
    { label: 'Share of the target', value: formatQuantity(progress.percentOfTarget, '%', 0) },
    toGoFigure(progress.toGoG),
    { label: 'Atmosphere used for gauge readings', value: formatPressure(ctx.atmosphericKpa, { decimals: 1 }) },
  )
  const onTarget = Math.abs(progress.toGoG) <= 0.02 * target!
  const verdict = onTarget ? 'pass' : progress.toGoG > 0 ? 'incomplete' : 'fail'
  return { verdict, summary: progress.note, figures, warnings: progress.warnings, cautions: [...new Set([...progress.cautions, ...cautions])] }
}

/** "Grams to go", or how far over the target the stage is. */
function toGoFigure(toGoG: number): StepFigure {
  return toGoG >= 0 ? { label: 'Grams to go', value: formatQuantity(toGoG, 'g', 0) } : { label: 'Over the target by', value: formatQuantity(-toGoG, 'g', 0) }
}

/**
 * Weighed in on a scale: the grams are the measure. With the room temperature and the stage's volume,
 * the standing pressure to expect once the stage has settled is shown too, so the gauge can confirm
 * the scale (and the design pressure is checked).
 */
function rechargeByScale(input: RechargeInput, ctx: StepContext, d: Designation, target: number | undefined, figures: StepFigure[], cautions: string[]): RepairStepResult {
  if (input.grams === undefined) refuse({ grams: ['Enter the grams weighed in on the scale'] })
  const start = input.startGrams ?? 0
  const now = start + input.grams
  figures.push({ label: 'Weighed in', value: formatQuantity(input.grams, 'g', 0) })
  if (start > 0) figures.push({ label: 'Already in before', value: formatQuantity(start, 'g', 0) }, { label: 'Grams in the stage', value: formatQuantity(now, 'g', 0) })
  if (target) {
    figures.push({ label: 'Target charge', value: formatQuantity(target, 'g', 0) }, { label: 'Share of the target', value: formatQuantity((now / target) * 100, '%', 0) }, toGoFigure(target - now))
  }
  const warnings: string[] = []
  let expect = ''
  if (input.ambientC !== undefined && ctx.stage.volumeL) {
    const unit = (input.pressureUnit ?? 'psig') as PressureUnit
    let progress: ReturnType<typeof chargingProgress>
    try {
      progress = chargingProgress(
        { designation: d, volumeL: ctx.stage.volumeL, ambientC: input.ambientC, targetChargeG: target ?? now, display: { unit, atmosphericKpa: ctx.atmosphericKpa },
          ...(ctx.stage.designPressureKpa ? { designPressureKpa: ctx.stage.designPressureKpa } : {}) },
        { by: 'weight', addedG: input.grams, startG: start },
      )
    } catch (error) {
      refuse({ grams: [error instanceof Error ? error.message : 'This charge is outside what the refrigerant can be at in this stage'] })
    }
    const measurable = progress.phase === 'gas' || progress.phase === 'supercritical'
    const shown = formatPressure(progress.standingPressureKpa, { unit, atmosphericKpa: ctx.atmosphericKpa })
    figures.push(
      { label: 'Standing pressure to expect, settled', value: measurable ? `${shown} at ${formatQuantity(input.ambientC, 'C', 1)} room` : `${shown}: partly liquid, the gauge cannot confirm the grams` },
      { label: 'Atmosphere used for gauge readings', value: formatPressure(ctx.atmosphericKpa, { decimals: 1 }) },
    )
    if (measurable) expect = ` Once settled at ${formatQuantity(input.ambientC, 'C', 1)} it should stand at ${shown}.`
    warnings.push(...progress.warnings.filter((w) => !w.startsWith('The target')))
  }
  const toGo = target ? target - now : undefined
  const against = target ? ` against a target of ${formatQuantity(target, 'g', 0)}${toGo !== undefined && toGo > 0 ? `, ${formatQuantity(toGo, 'g', 0)} to go` : ''}` : ''
  return {
    verdict: 'done',
    summary: `${formatQuantity(input.grams, 'g', 0)} of ${d} weighed in${start > 0 ? ` on top of ${formatQuantity(start, 'g', 0)}` : ''}${against}.${expect}`,
    figures, warnings, cautions,
  }
}

/** Judges a step from its figures on its stage; throws ImplausibleInputError (422) for figures that cannot be true or a safety gate not passed. */
export function evaluateStep(input: RepairStepInput, ctx: StepContext): RepairStepResult {
  switch (input.kind) {
    case 'pressure-hold':
      return pressureHold(input, ctx)
    case 'evacuation':
      return evacuation(input, ctx)
    case 'hot-work':
      return hotWork(input, ctx)
    case 'recharge':
      return recharge(input, ctx)
  }
}
