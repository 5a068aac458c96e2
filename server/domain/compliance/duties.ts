/**
 * Which units are due a leak check, a leak inspection, a repair or a verification, from the units, their
 * refrigerant logs and checks, the organisation's jurisdiction and today's date. Pure: the caller loads
 * the records and decides what to show; nothing here reads a clock.
 *
 * US rules (leak-rate limits): after an addition whose leak rate exceeds the limit, repair within the
 * rule's days, verify the repair, inspect for leaks at the rule's interval until a year has passed
 * without exceeding it, and report a stage that lost 125 % or more of its charge in a calendar year.
 * EU/GB rules (leak checks): check at the interval of the F-gas regime in force, re-check within a month
 * of a repair, and repair a leak found by a check without undue delay.
 */
import type { ApplianceType, LeakRateMethod } from '#shared/types/compliance'
import type { Stage } from '#shared/types/diagnosis'
import { addMonths, dayInYear, dayNumber, isoDay, yearOf } from './calendar'
import { assessFGasEquipment } from './f-gas'
import { governingRule } from './leak-rate'
import { stageRefrigerantLog, type LogCheck, type LogTransaction, type StageSetup } from './refrigerant-log'
import { inForce, requireJurisdiction, type LeakRateRule } from './regulation-data'
import { GRAMS_PER_POUND, figure } from './words'

/** What a unit can be due: a repair, a verification test, a leak inspection or check, a re-check after a repair, a report. */
export const DUTY_KINDS = ['repair', 'verification-test', 'leak-inspection', 'leak-check', 'recheck-after-repair', 'chronic-leak-report'] as const
export type DutyKind = (typeof DUTY_KINDS)[number]

export interface DutyUnit {
  id: string | number
  name: string
  applianceType?: ApplianceType
  hermeticallySealed?: boolean
  leakDetectionSystem?: boolean
  stages: StageSetup[]
}

export interface DutiesInput {
  units: readonly DutyUnit[]
  transactions: readonly (LogTransaction & { unitId: string | number })[]
  checks?: readonly (LogCheck & { unitId: string | number })[]
  jurisdiction: string
  today: string | Date
  /** Duties falling due within this many days (or overdue) are listed as due; default 30. */
  horizonDays?: number
  method?: LeakRateMethod
}

export interface Duty {
  unitId: string | number
  unitName: string
  stage: Stage | null
  kind: DutyKind
  dueBy: string
  daysLeft: number
  overdue: boolean
  text: string
  citation: string
}

export interface DutiesResult {
  today: string
  jurisdiction: string
  /** Every open duty, soonest first. */
  duties: Duty[]
  /** Duties overdue or falling due within the horizon. */
  due: Duty[]
  /** Units whose refrigerant logs raised questions (mixed refrigerants, missing cylinders, …). */
  logWarnings: { unitId: string | number; stage: Stage; warnings: string[] }[]
}

interface Ctx {
  unit: DutyUnit
  today: number
  push: (d: Omit<Duty, 'unitId' | 'unitName' | 'dueBy' | 'daysLeft' | 'overdue'> & { dueDay: number }) => void
}

const latest = (days: number[]) => (days.length ? Math.max(...days) : null)

function checksOf(all: readonly (LogCheck & { unitId: string | number })[], unitId: string | number, stage: Stage | null, kinds: LogCheck['kind'][]) {
  return all.filter((c) => String(c.unitId) === String(unitId) && kinds.includes(c.kind) && (stage === null || c.stage === undefined || c.stage === null || c.stage === stage))
}

function usStageDuties(ctx: Ctx, setup: StageSetup, rule: LeakRateRule, exceedDays: number[], allChecks: readonly (LogCheck & { unitId: string | number })[], lossByYear: Map<number, number>): void {
  const { unit, today, push } = ctx
  const stage = setup.stage
  const type = unit.applianceType ?? 'other'
  const lastExceed = latest(exceedDays)
  if (lastExceed !== null) {
    const repairs = checksOf(allChecks, unit.id, stage, ['repair']).map((c) => dayNumber(c.at)).filter((d) => d >= lastExceed)
    const repaired = latest(repairs)
    if (repaired === null) {
      push({ stage, kind: 'repair', dueDay: lastExceed + rule.repair.withinDays, citation: rule.citation, text: `Leak rate over the limit after the addition of ${isoDay(lastExceed)}: repair within ${rule.repair.withinDays} days (${rule.repair.withinDaysIfShutdown} if an industrial process shutdown is needed), or retrofit or retire under a written plan.` })
    } else {
      const verified = checksOf(allChecks, unit.id, stage, ['follow-up-verification']).some((c) => c.passed && dayNumber(c.at) >= repaired)
      // Initial and follow-up verification tests belong to the repair window (from memory of 82.157(e)).
      if (!verified) push({ stage, kind: 'verification-test', dueDay: Math.max(lastExceed + rule.repair.withinDays, repaired + 10), citation: rule.citation, text: `Repaired on ${isoDay(repaired)}: confirm it with the initial and follow-up verification tests.` })
    }
    const lb = setup.fullChargeG / GRAMS_PER_POUND
    const band = rule.leakInspections.find((b) => b.applianceTypes.includes(type) && lb >= b.fromFullChargeLb && (b.belowFullChargeLb === null || lb < b.belowFullChargeLb))
    if (band && today < addMonths(lastExceed, band.untilMonthsBelowThreshold)) {
      const inspections = checksOf(allChecks, unit.id, stage, ['leak-check']).map((c) => dayNumber(c.at)).filter((d) => d >= lastExceed)
      const from = latest(inspections) ?? lastExceed
      push({ stage, kind: 'leak-inspection', dueDay: addMonths(from, band.everyMonths), citation: rule.citation, text: `Over the limit on ${isoDay(lastExceed)}: inspect for leaks every ${band.everyMonths} months until the leak rate has stayed within the limit for ${band.untilMonthsBelowThreshold} months.` })
    }
  }
  const chronic = rule.chronicLeak
  if (chronic) {
    for (const [year, lossG] of lossByYear) {
      const pct = (lossG * 100) / setup.fullChargeG
      if (pct < chronic.percentOfFullChargePerCalendarYear) continue
      const reportBy = dayInYear(year + 1, chronic.reportByMonthDay)
      const reported = checksOf(allChecks, unit.id, stage, ['chronic-leak-report']).some((c) => yearOf(dayNumber(c.at)) === year + 1 || yearOf(dayNumber(c.at)) === year)
      if (!reported && today <= reportBy + 366) {
        push({ stage, kind: 'chronic-leak-report', dueDay: reportBy, citation: rule.citation, text: `${figure(pct, 0)} % of the full charge was added to make up losses in ${year} (${chronic.percentOfFullChargePerCalendarYear} % or more): report it to the EPA by ${isoDay(reportBy)}.` })
      }
    }
  }
}

function euUnitDuties(ctx: Ctx, regimeId: string, allChecks: readonly (LogCheck & { unitId: string | number })[]): void {
  const { unit, today, push } = ctx
  const assessment = assessFGasEquipment({
    basis: regimeId,
    circuits: unit.stages.map((s) => ({ designation: s.refrigerant, chargeG: s.fullChargeG })),
    hermeticallySealed: unit.hermeticallySealed,
    leakDetectionSystem: unit.leakDetectionSystem,
  })
  if (!assessment.leakCheckRequired || assessment.leakCheckIntervalMonths === null) return
  const months = assessment.leakCheckIntervalMonths
  const checkDays = checksOf(allChecks, unit.id, null, ['leak-check', 'follow-up-verification']).map((c) => dayNumber(c.at))
  const lastCheck = latest(checkDays)
  const since = latest(unit.stages.flatMap((s) => (s.since ? [dayNumber(s.since)] : [])))
  // "Every 12 months" is counted from the date of the last check, to the day before its anniversary
  // (German Environment Agency, F-gas FAQ: checked on 31 January, due by 30 January the next year).
  const dueDay = lastCheck !== null ? addMonths(lastCheck, months) - 1 : since !== null ? addMonths(since, months) - 1 : today
  const tonnes = `${figure(assessment.annexITonnesCo2e, 2)} t CO2e`
  push({ stage: null, kind: 'leak-check', dueDay, citation: `${assessment.regulation}`, text: lastCheck !== null ? `${tonnes}: leak check every ${months} months; last on ${isoDay(lastCheck)}.` : `${tonnes}: leak check every ${months} months; none on record.` })
  const lastRepair = latest(checksOf(allChecks, unit.id, null, ['repair']).map((c) => dayNumber(c.at)))
  if (lastRepair !== null && assessment.recheckAfterRepair && !checkDays.some((d) => d > lastRepair || (d === lastRepair && assessment.recheckAfterRepair!.notBeforeHours === 0))) {
    const r = assessment.recheckAfterRepair
    push({ stage: null, kind: 'recheck-after-repair', dueDay: addMonths(lastRepair, r.withinMonths), citation: `${assessment.regulation} ${r.citation}`, text: `Repaired on ${isoDay(lastRepair)}: check the repair ${r.notBeforeHours ? `no sooner than ${r.notBeforeHours} h after it and ` : ''}within ${r.withinMonths} month.` })
  }
  const failed = checksOf(allChecks, unit.id, null, ['leak-check']).filter((c) => !c.passed).map((c) => dayNumber(c.at))
  const lastLeak = latest(failed)
  if (lastLeak !== null && (lastRepair === null || lastRepair < lastLeak)) {
    push({ stage: null, kind: 'repair', dueDay: lastLeak, citation: assessment.regulation, text: `Leak found on ${isoDay(lastLeak)}: repair it without undue delay.` })
  }
}

/** The open compliance duties of every unit, soonest first, and those due within the horizon. */
export function complianceDuties(input: DutiesInput): DutiesResult {
  const j = requireJurisdiction(input.jurisdiction)
  const today = dayNumber(input.today)
  const horizon = input.horizonDays ?? 30
  const allChecks = input.checks ?? []
  const duties: Duty[] = []
  const logWarnings: DutiesResult['logWarnings'] = []
  for (const unit of input.units) {
    const push: Ctx['push'] = ({ dueDay, ...d }) =>
      duties.push({ unitId: unit.id, unitName: unit.name, ...d, dueBy: isoDay(dueDay), daysLeft: dueDay - today, overdue: dueDay < today })
    const ctx: Ctx = { unit, today, push }
    const unitTx = input.transactions.filter((t) => String(t.unitId) === String(unit.id))
    const unitChecks = allChecks.filter((c) => String(c.unitId) === String(unit.id))
    for (const setup of unit.stages) {
      const log = stageRefrigerantLog(setup, unitTx, { checks: unitChecks, method: input.method, jurisdiction: j.leakRateRules.length ? j.id : undefined, applianceType: unit.applianceType ?? 'other' })
      if (log.warnings.length) logWarnings.push({ unitId: unit.id, stage: setup.stage, warnings: log.warnings })
      const rule = governingRule({ jurisdiction: j.id, fullChargeG: setup.fullChargeG, date: isoDay(today), designation: setup.refrigerant, applianceType: unit.applianceType })
      if (!rule) continue
      const exceedDays = log.additions.filter((a) => a.assessment?.exceedsThreshold).map((a) => dayNumber(a.day))
      const lossByYear = new Map<number, number>()
      for (const a of log.additions) lossByYear.set(yearOf(dayNumber(a.day)), (lossByYear.get(yearOf(dayNumber(a.day))) ?? 0) + a.countedAsLossG)
      usStageDuties(ctx, setup, rule, exceedDays, unitChecks, lossByYear)
    }
    const regime = j.leakCheckRegimes.find((r) => inForce(r, today))
    if (regime) euUnitDuties(ctx, regime.regime, unitChecks)
  }
  duties.sort((a, b) => a.dueBy.localeCompare(b.dueBy) || String(a.unitName).localeCompare(String(b.unitName)))
  return { today: isoDay(today), jurisdiction: j.id, duties, due: duties.filter((d) => d.daysLeft <= horizon), logWarnings }
}
