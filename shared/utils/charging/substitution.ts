/**
 * Substitution planner: how much of another refrigerant to put into a stage whose nameplate names a
 * different one (a CFC low stage refilled with ethane or ethylene, say), on three bases side by side:
 * - standing pressure: the mass of the substitute that stands, at today's ambient, at the pressure the
 *   nameplate charge would stand at. Both fills are gases there, so this is about the same amount of
 *   substance (moles), which is what a gas-charged low stage and its expansion vessel were sized for.
 * - mass: the same grams.
 * - liquid volume: the same volume of saturated liquid at the design evaporating temperature, i.e. the
 *   same liquid inventory in the evaporator and capillary.
 * Each plan comes with its standing pressure, the reading to charge to in the technician's gauge unit, and
 * the checks a careful engineer would make before charging. Pure: the calculator page runs it in the browser
 * and POST /api/calculations/substitution on the server.
 */
import {
  OutOfRangeError, ambientAtStandingPressure, assertWithinEos, chargeFromStandingPressure, findRefrigerant, saturatedLiquidDensity, saturationPressure, standingPressureFromCharge,
  type AnyPressureUnit, type Designation, type RefrigerantInfo, type StandingPhase, type StandingResult,
} from '#shared/utils/properties'
import { fmtC, fmtKpa } from '#shared/utils/properties/errors'
import { designPressureWarnings, pressureReading, type PressureReading } from './readings'

export const SUBSTITUTION_BASES = ['standing-pressure', 'mass', 'liquid-volume'] as const
export type SubstitutionBasis = (typeof SUBSTITUTION_BASES)[number]

/**
 * A plan standing more than this far above the nameplate charge's standing pressure loads the stage, its
 * expansion vessel and relief valve beyond what they were sized for: common practice, no source.
 */
export const FAR_ABOVE_NAMEPLATE_RATIO = 1.25
/** Where a cascade low stage condenses when its condensing temperature is not given: common practice, no source. */
export const LOW_STAGE_CONDENSING_C = -25
/** Condensing temperature above ambient of a healthy air-cooled condenser: common practice, no source. */
export const AIR_CONDENSER_ABOVE_AMBIENT_K = 15
/** A fluid this close to (or above) its critical temperature at ambient cannot be air-condensed: it is a cascade low stage. */
const LOW_STAGE_CRITICAL_MARGIN_K = 25

export interface SubstitutionInput {
  volumeL: number
  ambientC: number
  from: { designation: Designation; chargeG: number }
  to: Designation
  basis: SubstitutionBasis
  /** Design evaporating temperature (°C): needed for the liquid-volume basis. */
  evaporatingC?: number
  /** Running condensing temperature of the stage (°C), for the head-pressure estimate; assumed when absent. */
  condensingC?: number
  /** Design (maximum allowable) pressure of the stage, kPa absolute. */
  designPressureKpa?: number
  /** How to show pressures to the technician: a unit and, for gauge units, the local atmosphere. */
  display: { unit: AnyPressureUnit; atmosphericKpa: number }
}

/** One basis's plan; `available: false` when it cannot be computed (its reason says why). */
export type SubstitutionPlan =
  | {
    basis: SubstitutionBasis
    available: true
    chargeG: number
    /** Where the planned charge stands at the ambient, kPa absolute. */
    standingPressureKpa: number
    phase: StandingPhase
    /** The reading to charge to, in the display unit; null when the standing pressure cannot measure this charge. */
    chargeTo: PressureReading | null
    explanation: string
    warnings: string[]
    amountMol: number
    densityKgM3: number
    /** Planned standing pressure over the nameplate charge's standing pressure. */
    ratioToNameplate: number
    /** Ambient (°C) at which this plan would reach the design pressure, when one is given and it is reached. */
    reachesDesignPressureAtC?: number
  }
  | { basis: SubstitutionBasis; available: false; reason: string }

export interface RunningHeadEstimate {
  condensingC: number
  /** True when the condensing temperature was assumed rather than given. */
  assumed: boolean
  assumption: string
  fromKpa: number | null
  toKpa: number | null
}

export interface SubstitutionResult {
  /** Top-level fields are the chosen basis's plan (the public fields first). */
  basis: SubstitutionBasis
  chargeG: number
  standingPressureKpa: number
  phase: StandingPhase
  warnings: string[]
  chargeTo: PressureReading | null
  explanation: string
  volumeL: number
  ambientC: number
  evaporatingC?: number
  designPressureKpa?: number
  from: { designation: Designation; name: string; safetyClass: string; chargeG: number; standingPressureKpa: number; phase: StandingPhase; amountMol: number }
  to: { designation: Designation; name: string; safetyClass: string; cautions: string[] }
  plans: SubstitutionPlan[]
  runningHead: RunningHeadEstimate
  /**
   * Where the chosen charge stands at other room temperatures, for the label on the unit and for a re-check
   * on another day (empty when the charge is partly liquid at ambient and pressure cannot measure it).
   */
  standingByAmbient: { ambientC: number; pressureKpa: number; reading: PressureReading }[]
  /** Things to do that are not dangers: relabelling, oil, logging. */
  notes: string[]
}

/** Room temperatures of the standing-pressure table printed with a plan (°C). */
export const LABEL_AMBIENTS_C = [10, 15, 20, 25, 30, 35] as const

const info = (d: Designation): RefrigerantInfo => findRefrigerant(d)!
const grams = (g: number) => `${g >= 100 ? g.toFixed(0) : g.toFixed(1)} g`

/** Plans a substitution on all three bases; the chosen basis must compute, or its error propagates (422). */
export function planSubstitution(input: SubstitutionInput): SubstitutionResult {
  const fromInfo = info(input.from.designation), toInfo = info(input.to)
  const nameplate = standingPressureFromCharge({ designation: fromInfo.designation, ambientC: input.ambientC, volumeL: input.volumeL, chargeG: input.from.chargeG })
  assertWithinEos(fromInfo.designation, nameplate, input.ambientC)
  const context: PlanContext = { input, fromInfo, toInfo, nameplate }
  const plans = SUBSTITUTION_BASES.map((basis) => planOneSafely(context, basis, basis === input.basis))
  const chosen = plans.find((p) => p.basis === input.basis)
  if (!chosen?.available) throw new OutOfRangeError(chosen && !chosen.available ? chosen.reason : 'No plan')
  const runningHead = estimateRunningHead(input, fromInfo, toInfo)
  const common = commonWarnings(input, fromInfo, toInfo, runningHead)
  return {
    basis: chosen.basis,
    chargeG: chosen.chargeG,
    standingPressureKpa: chosen.standingPressureKpa,
    phase: chosen.phase,
    warnings: [...chosen.warnings, ...common],
    chargeTo: chosen.chargeTo,
    explanation: chosen.explanation,
    volumeL: input.volumeL,
    ambientC: input.ambientC,
    ...(input.evaporatingC !== undefined ? { evaporatingC: input.evaporatingC } : {}),
    ...(input.designPressureKpa !== undefined ? { designPressureKpa: input.designPressureKpa } : {}),
    from: {
      designation: fromInfo.designation, name: fromInfo.name, safetyClass: fromInfo.safetyClass, chargeG: input.from.chargeG,
      standingPressureKpa: nameplate.pressureKpa, phase: nameplate.phase, amountMol: input.from.chargeG / fromInfo.molarMassGPerMol,
    },
    to: { designation: toInfo.designation, name: toInfo.name, safetyClass: toInfo.safetyClass, cautions: toInfo.cautions },
    plans,
    runningHead,
    standingByAmbient: chosen.chargeTo ? standingTable(input, chosen.chargeG) : [],
    notes: notesFor(fromInfo, toInfo),
  }
}

/** The chosen charge's standing pressure across ordinary room temperatures (those inside the EOS range). */
function standingTable(input: SubstitutionInput, chargeG: number): SubstitutionResult['standingByAmbient'] {
  const out: SubstitutionResult['standingByAmbient'] = []
  for (const ambientC of LABEL_AMBIENTS_C) {
    try {
      const r = standingPressureFromCharge({ designation: input.to, ambientC, volumeL: input.volumeL, chargeG })
      out.push({ ambientC, pressureKpa: r.pressureKpa, reading: pressureReading(r.pressureKpa, input.display) })
    } catch (error) {
      if (!(error instanceof OutOfRangeError)) throw error
    }
  }
  return out
}

interface PlanContext {
  input: SubstitutionInput
  fromInfo: RefrigerantInfo
  toInfo: RefrigerantInfo
  nameplate: StandingResult
}

/** A side plan that cannot be computed is shown as unavailable; the chosen one rethrows. */
function planOneSafely(c: PlanContext, basis: SubstitutionBasis, chosen: boolean): SubstitutionPlan {
  try {
    return planOne(c, basis)
  } catch (error) {
    if (chosen || !(error instanceof OutOfRangeError)) throw error
    return { basis, available: false, reason: error.message }
  }
}

function planOne(c: PlanContext, basis: SubstitutionBasis): SubstitutionPlan {
  const { input, fromInfo, toInfo, nameplate } = c
  const from = fromInfo.designation, to = toInfo.designation
  const { chargeG, explanation, basisWarnings } = chargeFor(c, basis)
  const planned = standingPressureFromCharge({ designation: to, ambientC: input.ambientC, volumeL: input.volumeL, chargeG })
  assertWithinEos(to, planned, input.ambientC)
  const ratio = nameplate.pressureKpa > 0 ? planned.pressureKpa / nameplate.pressureKpa : Infinity
  const warnings = [...planned.warnings, ...basisWarnings]
  if (ratio > FAR_ABOVE_NAMEPLATE_RATIO) {
    warnings.push(`This plan stands at ${fmtKpa(planned.pressureKpa)} abs at ${fmtC(input.ambientC)}, ${ratio.toFixed(1)} times the ${fmtKpa(nameplate.pressureKpa)} abs that the nameplate ${grams(input.from.chargeG)} of ${from} stands at. The stage, its expansion vessel and its relief valve were sized for the nameplate pressure: check their ratings before charging this much.`)
  }
  let reachesDesignPressureAtC: number | undefined
  if (input.designPressureKpa !== undefined) {
    reachesDesignPressureAtC = ambientAtStandingPressure(to, planned.densityKgM3, input.designPressureKpa, input.ambientC)
    warnings.push(...designPressureWarnings(planned.pressureKpa, input.designPressureKpa, reachesDesignPressureAtC, input.ambientC, input.display))
  }
  const measurable = planned.phase === 'gas' || planned.phase === 'supercritical'
  if (!measurable && planned.phase === 'two-phase') {
    warnings.push(`At ${fmtC(input.ambientC)} this charge of ${to} is partly liquid: its standing pressure is the saturation pressure (${fmtKpa(planned.pressureKpa)} abs) whatever the amount. Charge it by weight on a scale.`)
  }
  return {
    basis, available: true, chargeG, standingPressureKpa: planned.pressureKpa, phase: planned.phase,
    chargeTo: measurable ? pressureReading(planned.pressureKpa, input.display) : null,
    explanation, warnings: orderBySeverity(warnings), amountMol: chargeG / toInfo.molarMassGPerMol, densityKgM3: planned.densityKgM3,
    ratioToNameplate: ratio,
    ...(reachesDesignPressureAtC !== undefined ? { reachesDesignPressureAtC } : {}),
  }
}

/** The planned grams of the substitute on one basis, with the basis explained in figures. */
function chargeFor(c: PlanContext, basis: SubstitutionBasis): { chargeG: number; explanation: string; basisWarnings: string[] } {
  const { input, fromInfo, toInfo, nameplate } = c
  const from = fromInfo.designation, to = toInfo.designation
  const nameplateG = grams(input.from.chargeG)
  if (basis === 'mass') {
    return {
      chargeG: input.from.chargeG,
      explanation: `Same mass: ${nameplateG} of ${to} for the nameplate ${nameplateG} of ${from}. Simple to weigh, but ${to} has ${(fromInfo.molarMassGPerMol / toInfo.molarMassGPerMol).toFixed(2)} times as many moles per gram as ${from}, so the stage holds a very different amount of gas and liquid.`,
      basisWarnings: [],
    }
  }
  if (basis === 'liquid-volume') {
    if (input.evaporatingC === undefined) throw new OutOfRangeError('The liquid-volume basis needs the design evaporating temperature (evaporatingC).')
    const rhoFrom = saturatedLiquidDensity(from, input.evaporatingC)
    const rhoTo = saturatedLiquidDensity(to, input.evaporatingC)
    const litres = input.from.chargeG / rhoFrom
    const chargeG = litres * rhoTo
    return {
      chargeG,
      explanation: `Same liquid volume at the design evaporating temperature ${fmtC(input.evaporatingC)}: the nameplate ${nameplateG} of ${from} is ${litres.toFixed(3)} L of saturated liquid there (${rhoFrom.toFixed(1)} kg/m³); the same volume of ${to} (${rhoTo.toFixed(1)} kg/m³) is ${grams(chargeG)}. It keeps the liquid inventory of the evaporator and capillary when running.`,
      basisWarnings: [],
    }
  }
  const pKpa = nameplate.pressureKpa
  const basisWarnings: string[] = []
  if (nameplate.phase === 'two-phase' || nameplate.phase === 'liquid') {
    basisWarnings.push(`The nameplate charge of ${from} is ${nameplate.phase === 'liquid' ? 'liquid-full' : 'partly liquid'} at ${fmtC(input.ambientC)}: its standing pressure is its saturation pressure, not a measure of its amount, so the standing-pressure basis means little for this stage. Prefer the mass or liquid-volume basis.`)
  }
  const r = chargeFromStandingPressure({ designation: to, ambientC: input.ambientC, volumeL: input.volumeL, pressureKpa: pKpa })
  if (r.phase === 'two-phase') {
    basisWarnings.push(`${to} cannot stand at ${fmtKpa(pKpa)} abs at ${fmtC(input.ambientC)} without liquid: that is its saturation pressure. The plan is the least charge that reaches it; charge by weight instead.`)
  }
  const molesFrom = input.from.chargeG / fromInfo.molarMassGPerMol, molesTo = r.chargeG / toInfo.molarMassGPerMol
  return {
    chargeG: r.chargeG,
    explanation: `Same standing pressure at ${fmtC(input.ambientC)}: the nameplate ${nameplateG} of ${from} in ${input.volumeL} L stands at ${fmtKpa(pKpa)} abs; ${to} stands there with ${grams(r.chargeG)}. For two gases that is about the same amount of substance (${molesFrom.toFixed(2)} mol of ${from}, ${molesTo.toFixed(2)} mol of ${to}), which keeps the stage's pressures at standstill as designed.`,
    basisWarnings,
  }
}

/**
 * Running head pressure: the saturation pressure at the condensing temperature. Not given, it is assumed
 * from the nameplate refrigerant: one that cannot be air-condensed at this ambient belongs to a cascade low
 * stage (condensing in the cascade heat exchanger), any other condenses in air somewhat above ambient.
 */
export function estimateRunningHead(input: Pick<SubstitutionInput, 'condensingC' | 'ambientC'>, fromInfo: RefrigerantInfo, toInfo: RefrigerantInfo): RunningHeadEstimate {
  const lowStage = fromInfo.criticalTemperatureC < input.ambientC + LOW_STAGE_CRITICAL_MARGIN_K
  const assumed = input.condensingC === undefined
  const condensingC = input.condensingC ?? (lowStage ? LOW_STAGE_CONDENSING_C : input.ambientC + AIR_CONDENSER_ABOVE_AMBIENT_K)
  const assumption = assumed
    ? (lowStage
        ? `${fromInfo.designation} cannot be condensed by room air, so this is taken as a cascade low stage condensing at about ${fmtC(condensingC)} in the cascade heat exchanger. Give the condensing temperature for a better estimate.`
        : `Taken as an air-cooled stage condensing about ${AIR_CONDENSER_ABOVE_AMBIENT_K} K above the ${fmtC(input.ambientC)} ambient. Give the condensing temperature for a better estimate.`)
    : `At the given condensing temperature ${fmtC(condensingC)}.`
  return { condensingC, assumed, assumption, fromKpa: bubblePressureOrNull(fromInfo.designation, condensingC), toKpa: bubblePressureOrNull(toInfo.designation, condensingC) }
}

function bubblePressureOrNull(d: Designation, c: number): number | null {
  try {
    return saturationPressure(d, c).bubbleKpa
  } catch (error) {
    if (error instanceof OutOfRangeError) return null
    throw error
  }
}

/** Warnings that do not depend on the basis: head pressure, safety class, pressure class. */
function commonWarnings(input: SubstitutionInput, fromInfo: RefrigerantInfo, toInfo: RefrigerantInfo, head: RunningHeadEstimate): string[] {
  const out: string[] = []
  const to = toInfo.designation, from = fromInfo.designation
  if (head.toKpa === null && head.condensingC > toInfo.criticalTemperatureC) {
    out.push(`${to} cannot condense at ${fmtC(head.condensingC)}: that is above its critical temperature (${fmtC(toInfo.criticalTemperatureC)}). The stage would not work, and its discharge pressure would climb with the charge.`)
  } else if (head.toKpa !== null) {
    if (input.designPressureKpa !== undefined && head.toKpa > input.designPressureKpa) {
      out.push(`DANGER: running, ${to} would condense at about ${fmtKpa(head.toKpa)} abs (${fmtC(head.condensingC)}), above the stage's design pressure ${fmtKpa(input.designPressureKpa)} abs. Do not use ${to} in this stage.`)
    }
    if (head.fromKpa !== null && head.toKpa > head.fromKpa * FAR_ABOVE_NAMEPLATE_RATIO) {
      out.push(`Running head pressure: about ${fmtKpa(head.toKpa)} abs with ${to} against ${fmtKpa(head.fromKpa)} abs with ${from} (condensing at ${fmtC(head.condensingC)}). Check the compressor's pressure and motor ratings and the high-pressure cut-out setting.`)
    }
  }
  out.push(...safetyClassWarnings(fromInfo, toInfo))
  if (toInfo.highPressure && !fromInfo.highPressure) {
    out.push(`${to} runs at far higher pressures than ${from}: use gauges, hoses and a recovery cylinder rated for ${to}.`)
  }
  return orderBySeverity(out)
}

const FLAMMABILITY: Record<string, number> = { '1': 0, '2L': 1, '2': 2, '3': 3 }

/** From a safety class such as "A2L": toxicity letter and flammability rank (0 = none … 3 = high). */
function classParts(safetyClass: string): { toxic: boolean; flammability: number } {
  return { toxic: safetyClass.startsWith('B'), flammability: FLAMMABILITY[safetyClass.slice(1)] ?? 0 }
}

/** The cautions a change of ASHRAE 34 safety class calls for; they defer to local codes. */
export function safetyClassWarnings(fromInfo: RefrigerantInfo, toInfo: RefrigerantInfo): string[] {
  const a = classParts(fromInfo.safetyClass), b = classParts(toInfo.safetyClass)
  const out: string[] = []
  const to = toInfo.designation, from = fromInfo.designation
  if (b.flammability > a.flammability) {
    out.push(`Safety class changes from ${fromInfo.safetyClass} to ${toInfo.safetyClass}: ${to} is flammable${a.flammability === 0 ? `, ${from} was not` : ` and more so than ${from}`}. `
      + `Before charging, check the planned charge against the flammable-refrigerant charge limit for this equipment and the room it stands in; ventilate; keep ignition sources away and make sure no switch, relay, fan motor or heater near the refrigerant circuit can ignite a leak; `
      + `label the unit with the new refrigerant, its charge and its flammability. Local codes and the equipment maker decide whether the conversion is allowed.`)
  }
  if (b.toxic && !a.toxic) {
    out.push(`Safety class changes from ${fromInfo.safetyClass} to ${toInfo.safetyClass}: ${to} is toxic. Check the charge limit for the occupied space, detection and ventilation required by local codes, and label the unit.`)
  }
  return out
}

/** Non-danger steps a substitution brings: relabelling, oil, records. */
function notesFor(fromInfo: RefrigerantInfo, toInfo: RefrigerantInfo): string[] {
  if (fromInfo.designation === toInfo.designation) return ['Same refrigerant as the nameplate: every basis gives the nameplate charge.']
  const notes = [`Relabel the stage with ${toInfo.designation}, its charge and the date, and keep the nameplate record of the change.`]
  const mineralOilFriendly = (f: RefrigerantInfo['family']) => f === 'CFC' || f === 'HCFC' || f === 'HC'
  if (mineralOilFriendly(fromInfo.family) && !mineralOilFriendly(toInfo.family) && toInfo.family !== 'natural') {
    notes.push(`${toInfo.designation} (${toInfo.family}) does not mix with the mineral or alkylbenzene oil that ${fromInfo.designation} systems usually run on: check the compressor oil and oil return with the compressor maker (common practice).`)
  }
  if (toInfo.ozoneDepleting) notes.push(`${toInfo.designation} is ozone-depleting and no longer produced: use only recovered and reclaimed stock where local rules allow it.`)
  return notes
}

/** Loud warnings first: liquid-full and danger lines, then the rest in their order. */
function orderBySeverity(warnings: string[]): string[] {
  const loud = (w: string) => /^(LIQUID-FULL|DANGER)/.test(w)
  return [...warnings.filter(loud), ...warnings.filter((w) => !loud(w))]
}

