/**
 * Leak rate by the two methods of the US rules (40 CFR 82.152, "leak rate"; the same methods in
 * 84.106(b)) and whether a leak-rate limit applies to a stage, and is exceeded, in words.
 *
 * Annualizing method: (added ÷ full charge) ÷ (min(days since refrigerant was last added, 365) ÷ 365) × 100.
 * Rolling-average method: added over the past 365 days (or since the last successful follow-up
 * verification test, if shorter) ÷ full charge × 100. Both are unit-free ratios, so grams serve.
 */
import type { LeakRateRequest } from '#shared/schemas/compliance'
import { APPLIANCE_TYPE_LABELS, type ApplianceType, type LeakRateAssessmentDto, type LeakRateDto, type LeakRateMethod } from '#shared/types/compliance'
import { BadInputError } from '#server/domain/errors'
import { dayNumber } from './calendar'
import { inForce, requireJurisdiction, sourceOf, type Jurisdiction, type LeakRateRule } from './regulation-data'
import { requireDesignation, usSubstance } from './substances'
import { GRAMS_PER_POUND, clean, figure, gramsAndPounds } from './words'

/** The longest period the annualizing method divides by. */
export const MAX_ANNUALIZING_DAYS = 365

export interface LeakRateResult {
  leakRatePercent: number
  method: LeakRateMethod
  working: string
  daysUsed?: number
}

function requirePositive(value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0) throw new BadInputError(`${what} must be a number above 0`)
}
function requireNonNegative(value: number, what: string): void {
  if (!Number.isFinite(value) || value < 0) throw new BadInputError(`${what} must be a number of at least 0`)
}

/** Annualizing method: the % of the full charge that would be lost in a year at the loss rate since the last addition. */
export function annualizingLeakRate(addedG: number, fullChargeG: number, daysSinceLastAddition: number): LeakRateResult {
  requireNonNegative(addedG, 'The grams added')
  requirePositive(fullChargeG, 'The full charge')
  requirePositive(daysSinceLastAddition, 'The days since refrigerant was last added')
  const daysUsed = Math.min(daysSinceLastAddition, MAX_ANNUALIZING_DAYS)
  // One division at the end keeps the ratio exact where the figures allow (10 lb into 100 lb over 180 days).
  const leakRatePercent = clean((addedG * MAX_ANNUALIZING_DAYS * 100) / (fullChargeG * daysUsed))
  const capped = daysSinceLastAddition > MAX_ANNUALIZING_DAYS ? ` (${figure(daysSinceLastAddition, 1)} days, capped at 365)` : ''
  return {
    leakRatePercent,
    method: 'annualizing',
    daysUsed,
    working: `(${figure(addedG, 1)} g ÷ ${figure(fullChargeG, 1)} g) ÷ (${figure(daysUsed, 1)} d${capped} ÷ 365 d) × 100 = ${figure(leakRatePercent, 2)} % per year`,
  }
}

/** Rolling-average method: everything added over the past 365 days as a % of the full charge. */
export function rollingAverageLeakRate(addedLast365DaysG: number, fullChargeG: number): LeakRateResult {
  requireNonNegative(addedLast365DaysG, 'The grams added over the past 365 days')
  requirePositive(fullChargeG, 'The full charge')
  const leakRatePercent = clean((addedLast365DaysG * 100) / fullChargeG)
  return {
    leakRatePercent,
    method: 'rolling-average',
    working: `${figure(addedLast365DaysG, 1)} g added over the past 365 days ÷ ${figure(fullChargeG, 1)} g × 100 = ${figure(leakRatePercent, 2)} % per year`,
  }
}

export interface LeakRateContext {
  jurisdiction: string
  /** The stage's full charge, grams. */
  fullChargeG: number
  /** The day the refrigerant was added (decides which rule was in force). */
  date: string | Date
  designation?: string
  applianceType?: ApplianceType
}

type Coverage = { covered: true } | { covered: false; why: string } | { covered: null }

function coverage(rule: LeakRateRule, designation: string | undefined): Coverage {
  if (designation === undefined) return { covered: null }
  const s = usSubstance(designation)
  if (!s) return { covered: false, why: `${designation} is not in the US substance table` }
  if (rule.covers.usClasses.includes(s.usClass)) return { covered: true }
  const gwpLimit = rule.covers.substitutesAboveGwp
  if (s.usClass === 'substitute' && gwpLimit !== null) {
    return s.gwpAR4 > gwpLimit ? { covered: true } : { covered: false, why: `${designation} (${s.name}) has a GWP of ${figure(s.gwpAR4)}, not above ${gwpLimit}` }
  }
  const what: Record<string, string> = {
    'ods-class-i': 'a class I ozone-depleting substance',
    'ods-class-ii': 'a class II ozone-depleting substance',
    hfc: 'an HFC or contains one',
    substitute: 'a substitute refrigerant that is neither ozone-depleting nor an HFC',
  }
  return { covered: false, why: `${designation} (${s.name}) is ${what[s.usClass]}` }
}

function limitsText(rule: LeakRateRule): string {
  return Object.entries(rule.thresholdsPercent)
    .map(([type, pct]) => `${pct} % ${APPLIANCE_TYPE_LABELS[type as ApplianceType].toLowerCase()}`)
    .join('; ')
}

type Verdict = Partial<Pick<LeakRateAssessmentDto, 'thresholdPercent' | 'exceedsThreshold' | 'repairWithinDays' | 'sources'>>

/** One answer shape for every outcome, so each branch states only what it knows. */
function answer(j: Jurisdiction, applies: boolean | null, rule: LeakRateRule | null, text: string[], more: Verdict = {}): LeakRateAssessmentDto {
  return {
    jurisdiction: j.id,
    applies,
    rule: rule ? { id: rule.id, title: rule.title, citation: rule.citation } : null,
    thresholdPercent: null,
    exceedsThreshold: null,
    repairWithinDays: null,
    sources: rule ? [sourceOf(j.sources, rule.source)] : [],
    ...more,
    text,
  }
}

/**
 * Whether a leak-rate rule of the jurisdiction covers this stage on `date` (refrigerant class, full
 * charge, appliance type) and, when it does and the appliance type is known, whether the rate exceeds
 * the limit (a rate equal to the limit does not: the rules speak of a leak rate "over" the limit).
 */
export function assessLeakRate(leakRatePercent: number, ctx: LeakRateContext): LeakRateAssessmentDto {
  const j = requireJurisdiction(ctx.jurisdiction)
  const designation = ctx.designation === undefined ? undefined : requireDesignation(ctx.designation)
  const day = dayNumber(ctx.date)
  const onDate = typeof ctx.date === 'string' ? ctx.date.slice(0, 10) : ctx.date.toISOString().slice(0, 10)
  if (!j.leakRateRules.length) {
    return answer(j, false, null, [`${j.name} sets no leak-rate limit; it requires leak checks at intervals instead (see the CO2-equivalent calculation).`])
  }
  const rules = j.leakRateRules.filter((r) => inForce(r, day))
  if (!rules.length) return answer(j, false, null, [`No leak-rate rule of ${j.name} was in force on ${onDate}.`])
  const reasons: string[] = []
  const open: LeakRateRule[] = []
  for (const rule of rules) {
    const c = coverage(rule, designation)
    if (c.covered === false) reasons.push(`${rule.citation} does not cover it: ${c.why}.`)
    else open.push(rule)
  }
  if (!open.length) {
    return answer(j, false, null, [...reasons, 'No leak-rate limit applies. Recovery and the ban on knowingly venting refrigerant still apply to most refrigerants whatever the charge; check the rules for this one.'])
  }
  if (designation === undefined) {
    const text = ['Give the refrigerant to tell whether a leak-rate limit applies.', ...open.map((r) => `${r.citation} (${r.title.toLowerCase()}) applies from ${r.minFullChargeLb} lb full charge; limits: ${limitsText(r)}.`)]
    return answer(j, null, null, text, { sources: open.map((r) => sourceOf(j.sources, r.source)) })
  }
  const rule = open[0]!
  const note = rule.coverageNote ? [rule.coverageNote] : []
  if (ctx.fullChargeG / GRAMS_PER_POUND < rule.minFullChargeLb) {
    return answer(j, false, rule, [`${rule.citation} covers ${designation} only from a full charge of ${rule.minFullChargeLb} lb; this stage holds ${gramsAndPounds(ctx.fullChargeG)}, so no leak-rate limit applies.`, ...note])
  }
  if (ctx.applianceType && rule.excludedApplianceTypes.includes(ctx.applianceType)) {
    return answer(j, false, rule, [`${rule.citation} excludes ${APPLIANCE_TYPE_LABELS[ctx.applianceType].toLowerCase()}, so no leak-rate limit applies.`, ...note])
  }
  const covered = `${rule.citation} covers ${designation} at ${gramsAndPounds(ctx.fullChargeG)} (from ${rule.minFullChargeLb} lb).`
  if (!ctx.applianceType) return answer(j, true, rule, [covered, `Give the appliance type to compare: limits are ${limitsText(rule)}.`, ...note])
  const threshold = rule.thresholdsPercent[ctx.applianceType]!
  const exceeds = leakRatePercent > threshold
  const type = APPLIANCE_TYPE_LABELS[ctx.applianceType].toLowerCase()
  const verdict = exceeds
    ? `A leak rate of ${figure(leakRatePercent, 2)} % per year exceeds the ${threshold} % limit for ${type}: repair the leak within ${rule.repair.withinDays} days of this addition (${rule.repair.withinDaysIfShutdown} days if an industrial process shutdown is needed), verify the repair, or retrofit or retire the appliance under a written plan.`
    : `A leak rate of ${figure(leakRatePercent, 2)} % per year is within the ${threshold} % limit for ${type}.`
  return answer(j, true, rule, [covered, verdict, ...note], { thresholdPercent: threshold, exceedsThreshold: exceeds, repairWithinDays: exceeds ? rule.repair.withinDays : null })
}

/** The rule of the jurisdiction that governs a stage on `date`, if one covers its refrigerant and charge. */
export function governingRule(ctx: Omit<LeakRateContext, 'applianceType'> & { applianceType?: ApplianceType }): LeakRateRule | undefined {
  const j = requireJurisdiction(ctx.jurisdiction)
  if (ctx.designation === undefined) return undefined
  const designation = requireDesignation(ctx.designation)
  const day = dayNumber(ctx.date)
  const chargeLb = ctx.fullChargeG / GRAMS_PER_POUND
  return j.leakRateRules.find(
    (r) => inForce(r, day) && coverage(r, designation).covered === true && chargeLb >= r.minFullChargeLb && !(ctx.applianceType && r.excludedApplianceTypes.includes(ctx.applianceType)),
  )
}

/** Which jurisdiction a bare leak-rate request is judged against when it names none. */
export const DEFAULT_LEAK_RATE_JURISDICTION = 'us-federal'

/**
 * The leak-rate calculation of the API: the rate by the requested method and, when the request names
 * a refrigerant or an appliance type, the verdict against the limit in force on `date` (default today).
 */
export function leakRateCalculation(input: LeakRateRequest, today: Date): LeakRateDto {
  const result =
    input.method === 'annualizing'
      ? annualizingLeakRate(input.addedG, input.fullChargeG, input.daysSinceLastAddition)
      : rollingAverageLeakRate(input.addedLast365DaysG, input.fullChargeG)
  const wantsVerdict = input.designation !== undefined || input.applianceType !== undefined || input.jurisdiction !== undefined
  if (!wantsVerdict) return result
  const assessment = assessLeakRate(result.leakRatePercent, {
    jurisdiction: input.jurisdiction ?? DEFAULT_LEAK_RATE_JURISDICTION,
    fullChargeG: input.fullChargeG,
    date: input.date ?? today,
    ...(input.designation !== undefined ? { designation: input.designation } : {}),
    ...(input.applianceType !== undefined ? { applianceType: input.applianceType } : {}),
  })
  return { ...result, assessment }
}
