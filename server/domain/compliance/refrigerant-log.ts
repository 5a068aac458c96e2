/**
 * The refrigerant log of one stage: every gram added or recovered, the charge history that follows,
 * the current charge, and the leak rate after each addition by both US methods.
 *
 * How additions count towards the leak rate (40 CFR 82.152, 82.157(b); 84.106(b)):
 * - Several additions for the same leak (same case, or the same day) are one addition.
 * - An addition right after installation or a retrofit, or for seasonal variance, gets no leak rate.
 * - Refrigerant put back after it was recovered for a repair is not a loss: only what is added beyond
 *   the grams recovered since the previous addition counts (EPA's reading in the 2016 rule's preamble,
 *   from memory). A technician may say otherwise with `purpose: 'top-up'`.
 * - The annualizing method divides by the days since refrigerant was last added (at most 365). For the
 *   first addition on record it uses the days since the log started, or 365 when that is unknown.
 * - The rolling average sums the past 365 days, or only what came after the last passed follow-up
 *   verification test, whichever is shorter.
 */
import type { ApplianceType, LeakRateAssessmentDto, LeakRateMethod } from '#shared/types/compliance'
import type { Stage } from '#shared/types/diagnosis'
import type { AdditionEventDto, AdditionPurpose, CheckKind, LogEntryDto } from '#shared/types/refrigerant-log'
import { BadInputError } from '#server/domain/errors'
import { dayNumber, instant, isoDay } from './calendar'
import { MAX_ANNUALIZING_DAYS, assessLeakRate } from './leak-rate'
import { canonicalDesignation } from './substances'
import { clean, figure } from './words'

export { ADDITION_PURPOSES, CHECK_KINDS, type AdditionPurpose, type CheckKind } from '#shared/types/refrigerant-log'

/** One line of the log as the case record keeps it. */
export interface LogTransaction {
  id?: string | number
  at: string | Date
  stage: Stage
  refrigerant: string
  grams: number
  direction: 'added' | 'recovered'
  cylinder?: string | null
  technician?: string | null
  caseId?: string | number | null
  /** Why refrigerant was added, when the technician said so; otherwise inferred (see the header). */
  purpose?: AdditionPurpose | null
}


/** A leak check, repair, verification test or report, with its outcome. */
export interface LogCheck {
  at: string | Date
  /** The stage it concerns; omitted when it covers the whole unit. */
  stage?: Stage | null
  kind: CheckKind
  /** Leak checks and verification tests: true when no leak was found. */
  passed: boolean
}

export interface StageSetup {
  stage: Stage
  refrigerant: string
  /** Nameplate (full) charge, grams. */
  fullChargeG: number
  /** When the log starts (commissioning); the first addition's days are counted from here. */
  since?: string | Date | null
  /** Charge at the start of the log; the full charge unless the log opens with an initial charge. */
  openingChargeG?: number
}

export interface LogOptions {
  checks?: LogCheck[]
  /** The facility's method; both are computed, this one is judged against the limit. */
  method?: LeakRateMethod
  /** With a jurisdiction, each addition is judged against the limit in force on its day. */
  jurisdiction?: string
  applianceType?: ApplianceType
}

/** One line of a stage's log with the charge after it; the wire shape is the DTO itself. */
export type LogEntry = LogEntryDto

/** One addition for leak-rate purposes: one or more log lines for the same leak; the wire shape is the DTO itself. */
export type AdditionEvent = AdditionEventDto

export interface StageLog {
  stage: Stage
  refrigerant: string
  fullChargeG: number
  entries: LogEntry[]
  additions: AdditionEvent[]
  currentChargeG: number
  totalAddedG: number
  totalRecoveredG: number
  /** Refrigerant added to make up losses, i.e. presumed leaked. */
  presumedLostG: number
  recoveredByCylinder: { cylinder: string; refrigerant: string; grams: number }[]
  warnings: string[]
}

const EXEMPT: Partial<Record<AdditionPurpose, string>> = {
  'initial-charge': 'first charge of a new installation',
  retrofit: 'charge right after a retrofit to another refrigerant',
  'seasonal-variance': 'seasonal variance: refrigerant put back that was removed for the season',
}

function checkLine(t: LogTransaction, i: number): void {
  if (!Number.isFinite(t.grams) || t.grams <= 0) throw new BadInputError(`Log line ${i + 1}: grams must be a number above 0`)
  if (t.direction !== 'added' && t.direction !== 'recovered') throw new BadInputError(`Log line ${i + 1}: direction must be "added" or "recovered"`)
  instant(t.at)
}

function sameRefrigerant(a: string, b: string): boolean {
  return (canonicalDesignation(a) ?? a.trim().toUpperCase()) === (canonicalDesignation(b) ?? b.trim().toUpperCase())
}

/** Builds the stage's log in time order; `transactions` may hold other stages' lines, which are skipped. */
export function stageRefrigerantLog(setup: StageSetup, transactions: readonly LogTransaction[], options: LogOptions = {}): StageLog {
  if (!Number.isFinite(setup.fullChargeG) || setup.fullChargeG <= 0) throw new BadInputError('The stage needs a full charge above 0 g')
  const lines = transactions
    .map((t, i) => ({ t, i }))
    .filter(({ t }) => t.stage === setup.stage)
    .map(({ t, i }) => (checkLine(t, i), { t, i, ms: instant(t.at) }))
    .sort((a, b) => a.ms - b.ms || a.i - b.i)
  const full = setup.fullChargeG
  const opensWithInitial = lines[0]?.t.direction === 'added' && lines[0].t.purpose === 'initial-charge'
  let charge = setup.openingChargeG ?? (opensWithInitial ? 0 : full)
  let pendingRecovered = 0
  let totalAdded = 0
  let totalRecovered = 0
  let presumedLost = 0
  const warnings: string[] = []
  const entries: LogEntry[] = []
  const recovered = new Map<string, { cylinder: string; refrigerant: string; grams: number }>()
  const groups: { key: string; day: number; caseId: string | number | null; indexes: number[]; added: number; loss: number; exempt: string | null }[] = []

  for (const { t, ms } of lines) {
    const index = entries.length
    const lineWarnings: string[] = []
    if (!sameRefrigerant(t.refrigerant, setup.refrigerant)) {
      lineWarnings.push(`${t.refrigerant} logged on a ${setup.refrigerant} stage: check the label and the log; mixed refrigerants cannot be reclaimed.`)
    }
    let countedAsLoss = 0
    if (t.direction === 'recovered') {
      totalRecovered += t.grams
      pendingRecovered += t.grams
      if (t.grams > charge + 1e-9) lineWarnings.push(`Recovered ${figure(t.grams, 0)} g, more than the ${figure(charge, 0)} g the log puts in the stage: an earlier addition or the nameplate charge may be missing.`)
      charge = Math.max(0, charge - t.grams)
      const cyl = (t.cylinder ?? '').trim()
      if (!cyl) lineWarnings.push('Recovered refrigerant without a cylinder: record which cylinder it went into.')
      const key = `${cyl.toUpperCase()}|${t.refrigerant}`
      const r = recovered.get(key) ?? { cylinder: cyl || '(none recorded)', refrigerant: t.refrigerant, grams: 0 }
      r.grams += t.grams
      recovered.set(key, r)
    } else {
      totalAdded += t.grams
      const exempt = t.purpose ? (EXEMPT[t.purpose] ?? null) : null
      if (exempt) countedAsLoss = 0
      else if (t.purpose === 'top-up') countedAsLoss = t.grams
      else countedAsLoss = Math.max(0, t.grams - pendingRecovered)
      pendingRecovered = Math.max(0, pendingRecovered - t.grams)
      const after = charge + t.grams
      // Technicians charge to the nameplate: what the log would put above it was lost beforehand.
      if (after > full && !exempt) presumedLost += after - full
      charge = exempt ? after : Math.min(after, full)
      if (exempt && after > full * 1.05) lineWarnings.push(`The log puts ${figure(after, 0)} g in a stage rated for ${figure(full, 0)} g.`)
      const day = dayNumber(new Date(ms))
      const key = t.caseId !== null && t.caseId !== undefined && t.caseId !== '' ? `case:${t.caseId}` : `day:${day}`
      const last = groups[groups.length - 1]
      const lastEntry = last ? entries[last.indexes[last.indexes.length - 1]!] : undefined
      const onlyAdditionsSince = lastEntry ? entries.slice(lastEntry.index + 1).every((e) => e.direction === 'added') : false
      if (last && (last.key === key || last.day === day) && !exempt === !last.exempt && onlyAdditionsSince) {
        last.indexes.push(index)
        last.added += t.grams
        last.loss += countedAsLoss
        last.day = day
      } else {
        groups.push({ key, day, caseId: t.caseId ?? null, indexes: [index], added: t.grams, loss: countedAsLoss, exempt })
      }
    }
    entries.push({
      index,
      ...(t.id !== undefined ? { id: t.id } : {}),
      at: new Date(ms).toISOString(),
      day: isoDay(dayNumber(new Date(ms))),
      direction: t.direction,
      grams: t.grams,
      refrigerant: t.refrigerant,
      cylinder: t.cylinder?.trim() || null,
      technician: t.technician ?? null,
      caseId: t.caseId ?? null,
      purpose: t.purpose ?? null,
      chargeAfterG: clean(charge),
      countedAsLossG: clean(countedAsLoss),
      warnings: lineWarnings,
    })
  }

  const additions = leakRateEvents(setup, groups, options)
  for (const e of entries) warnings.push(...e.warnings.map((w) => `${e.day}: ${w}`))
  return {
    stage: setup.stage,
    refrigerant: setup.refrigerant,
    fullChargeG: full,
    entries,
    additions,
    currentChargeG: clean(charge),
    totalAddedG: clean(totalAdded),
    totalRecoveredG: clean(totalRecovered),
    presumedLostG: clean(presumedLost),
    recoveredByCylinder: [...recovered.values()].map((r) => ({ ...r, grams: clean(r.grams) })),
    warnings,
  }
}

function leakRateEvents(
  setup: StageSetup,
  groups: { day: number; caseId: string | number | null; indexes: number[]; added: number; loss: number; exempt: string | null }[],
  options: LogOptions,
): AdditionEvent[] {
  const full = setup.fullChargeG
  const resets = (options.checks ?? [])
    .filter((c) => c.kind === 'follow-up-verification' && c.passed && (c.stage === undefined || c.stage === null || c.stage === setup.stage))
    .map((c) => dayNumber(c.at))
  const sinceDay = setup.since ? dayNumber(setup.since) : null
  const method = options.method ?? 'annualizing'
  const events: AdditionEvent[] = []
  groups.forEach((g, k) => {
    const prev = k > 0 ? groups[k - 1]!.day : null
    const daysSince = prev === null ? null : g.day - prev
    const base = { day: isoDay(g.day), entryIndexes: g.indexes, caseId: g.caseId, addedG: clean(g.added), countedAsLossG: clean(g.loss), daysSinceLastAddition: daysSince }
    if (g.exempt) {
      events.push({ ...base, daysUsed: null, annualizingPercent: null, rollingAveragePercent: null, exemptBecause: g.exempt, note: `No leak rate: ${g.exempt}.`, assessment: null })
      return
    }
    const firstDays = sinceDay !== null && g.day > sinceDay ? g.day - sinceDay : MAX_ANNUALIZING_DAYS
    const daysUsed = Math.min(Math.max(daysSince ?? firstDays, 1), MAX_ANNUALIZING_DAYS)
    const annualizingPercent = clean((g.loss * MAX_ANNUALIZING_DAYS * 100) / (full * daysUsed))
    const reset = Math.max(-Infinity, ...resets.filter((d) => d < g.day))
    const windowStart = Math.max(g.day - MAX_ANNUALIZING_DAYS, reset)
    const inWindow = groups.slice(0, k + 1).filter((o) => !o.exempt && o.day > windowStart)
    const rollingAveragePercent = clean((inWindow.reduce((s, o) => s + o.loss, 0) * 100) / full)
    const notes: string[] = []
    if (daysSince === null) notes.push(sinceDay !== null && g.day > sinceDay ? `First addition on record: days counted from the start of the log (${daysUsed} d).` : 'First addition on record: the annualizing method uses 365 days.')
    if (g.loss < g.added) notes.push(`${figure(g.added - g.loss, 0)} g of the ${figure(g.added, 0)} g put back refrigerant recovered for the work; only ${figure(g.loss, 0)} g count as a loss.`)
    if (reset > -Infinity && reset > g.day - MAX_ANNUALIZING_DAYS) notes.push(`Rolling average counts only additions after the passed follow-up verification of ${isoDay(reset)}.`)
    const rate = method === 'annualizing' ? annualizingPercent : rollingAveragePercent
    const assessment = options.jurisdiction
      ? assessLeakRate(rate, { jurisdiction: options.jurisdiction, fullChargeG: full, date: isoDay(g.day), designation: setup.refrigerant, ...(options.applianceType ? { applianceType: options.applianceType } : {}) })
      : null
    events.push({ ...base, daysUsed, annualizingPercent, rollingAveragePercent, exemptBecause: null, note: notes.join(' '), assessment })
  })
  return events
}

/** What went into and came out of each cylinder, over any number of units; warns of mixed refrigerants. */
export function cylinderLedger(transactions: readonly (LogTransaction & { unitId?: string | number })[]) {
  const byCylinder = new Map<string, { cylinder: string; recoveredG: Map<string, number>; chargedG: Map<string, number>; units: Set<string> }>()
  for (const t of transactions) {
    const name = t.cylinder?.trim()
    if (!name) continue
    const key = name.toUpperCase()
    const c = byCylinder.get(key) ?? { cylinder: name, recoveredG: new Map(), chargedG: new Map(), units: new Set<string>() }
    const into = t.direction === 'recovered' ? c.recoveredG : c.chargedG
    const gas = canonicalDesignation(t.refrigerant) ?? t.refrigerant
    into.set(gas, (into.get(gas) ?? 0) + t.grams)
    if (t.unitId !== undefined) c.units.add(String(t.unitId))
    byCylinder.set(key, c)
  }
  return [...byCylinder.values()].map((c) => {
    const gases = new Set([...c.recoveredG.keys(), ...c.chargedG.keys()])
    const warnings: string[] = []
    if (gases.size > 1) warnings.push(`Cylinder ${c.cylinder} has held ${[...gases].join(' and ')}: keep one refrigerant per cylinder, a mixed recovery cylinder cannot be reclaimed (common practice, no source).`)
    return {
      cylinder: c.cylinder,
      recovered: [...c.recoveredG].map(([refrigerant, grams]) => ({ refrigerant, grams: clean(grams) })),
      charged: [...c.chargedG].map(([refrigerant, grams]) => ({ refrigerant, grams: clean(grams) })),
      units: [...c.units],
      warnings,
    }
  })
}
