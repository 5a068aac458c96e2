// What each change to a case may do, as plain functions: current state and input in, the fields to
// save and the timeline events to append out. The case service loads the state, calls one planner,
// re-ranks when the plan asks, and commits. No I/O here.
import type { CaseClosure, CaseReading, CaseTestResult, RefrigerantTransactionDto } from '#shared/types/cases'
import type { Revision } from '#shared/types/repair-steps'
import type { Cause, RankResponse, Reading, ReadingUnit, Stage, Symptom, TestSlug } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import type { RepairStepInput, RepairStepRecord } from '#shared/types/repair-steps'
import { formatReading } from '#shared/utils/format'
import { isDesignation } from '#shared/utils/properties'
import { fieldMessage, readingName, stageLabel, stageList } from '#shared/utils/vocabulary'
import { BadInputError, ConfirmationNeededError, ConflictError, ImplausibleInputError, NotFoundError } from '../errors'
import type { CaseState, NewEvent } from './case-record'
import { checkReadings, envelopeMessage } from './plausibility'
import { evaluateStep } from './repair-steps'

/** Columns a case change may set. */
export type CaseFieldChanges = Partial<{
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
  steps: RepairStepRecord[]
  reportPhotoIds: number[]
  ranking: RankResponse
  notes: string
  status: 'closed'
  closure: CaseClosure
  confirmedCauses: CaseClosure['confirmedCauses']
  closedAt: Date
}>

/** One planned change: what to save, what to append to the timeline, and whether to rank again. */
export interface CaseChange {
  changes: CaseFieldChanges
  events: NewEvent[]
  rerank: boolean
}

/** The state a planner reads: the case's fields and its notes so far. */
export type CurrentCase = CaseState & { notes: string }

/** Refuses a change to a closed case, or one based on an outdated version of it. */
export function assertWritable(state: Pick<CaseState, 'status' | 'lockVersion'>, expectedVersion: number | undefined): void {
  if (state.status === 'closed') {
    throw new ConflictError('This case is closed. Add an addendum instead of changing the record.')
  }
  if (expectedVersion !== undefined && expectedVersion !== state.lockVersion) {
    throw new ConflictError(
      `This case was changed by someone else (your copy is version ${expectedVersion}, the case is at version ${state.lockVersion}). Reload to see their changes, then enter yours again.`,
    )
  }
}

/**
 * Refuses items on a stage the unit does not have, everywhere with the same answer: a 400 with a
 * message per item at `field.i.stage`, naming the stages in words.
 */
export function assertStagesOf(unit: UnitDto, items: readonly { stage?: Stage }[], field: string): void {
  const stages = unit.stages.map((s) => s.stage)
  const fieldErrors: Record<string, string[]> = {}
  const messages: string[] = []
  items.forEach((item, i) => {
    if (!item.stage || stages.includes(item.stage)) return
    const message = `${stageLabel(item.stage)} is not a stage of ${unit.name}; it has ${stageList(stages)}`
    fieldErrors[`${field}.${i}.stage`] = [message]
    messages.push(fieldMessage([field, i], message))
  })
  if (messages.length) throw new BadInputError(messages.join('; '), fieldErrors)
}

/**
 * Readings appended to the case, each stamped with when and by whom; the ranking follows. Readings
 * that cannot be true are refused (422, nothing saved); readings far outside the unit's design
 * envelope are refused until confirmed with a reason, and then carry that confirmation. Once a
 * repair step is recorded, a reading without a phase is taken during the repair, so it is reported
 * but no longer moves the diagnosis.
 */
export function planReadings(
  unit: UnitDto, current: CurrentCase, readings: Reading[], by: number, now: Date,
  options: { atmosphericKpa: number; confirmations?: { index: number; reason: string }[] },
): CaseChange {
  assertStagesOf(unit, readings, 'readings')
  const reasons = new Map((options.confirmations ?? []).map((c) => [c.index, c.reason]))
  const verdict = checkReadings(unit, readings, options.atmosphericKpa, new Set(reasons.keys()))
  const impossible = Object.entries(verdict.impossible)
  if (impossible.length) {
    throw new ImplausibleInputError(
      impossible.map(([field, [message]]) => fieldMessage(field.split('.'), message!)).join('; '),
      verdict.impossible,
    )
  }
  if (verdict.outsideEnvelope.length) {
    const fieldErrors = Object.fromEntries(verdict.outsideEnvelope.map((q) => [`readings.${q.index}.value`, [`${q.message} Confirm it with a reason to keep it.`]]))
    throw new ConfirmationNeededError(
      `${verdict.outsideEnvelope.map((q) => q.message).join(' ')} Check the figure and its unit; if it is what the instrument shows, confirm it with a reason.`,
      fieldErrors, verdict.outsideEnvelope,
    )
  }
  const at = now.toISOString()
  const inRepair = (current.steps ?? []).some((s) => !s.struck)
  const added: CaseReading[] = readings.map((r, i) => {
    const reading: CaseReading = { ...r, at, by }
    if (!reading.phase && inRepair) reading.phase = 'repair'
    const reason = reasons.get(i)
    const message = reason ? envelopeMessage(unit, r, options.atmosphericKpa) : undefined
    if (reason && message) reading.confirmedOutside = { message, reason }
    return reading
  })
  const offset = current.readings.length
  return {
    changes: { readings: [...current.readings, ...added] },
    events: added.map((r, i) => ({
      type: 'reading-entered',
      payload: {
        quantity: r.quantity, stage: r.stage, value: r.value, unit: r.unit, index: offset + i,
        ...(r.phase ? { phase: r.phase } : {}), ...(r.confirmedOutside ? { confirmedOutside: r.confirmedOutside } : {}),
      },
    })),
    rerank: true,
  }
}

function entryOf<T>(list: readonly T[], index: number, what: string): T {
  const entry = list[index]
  if (!entry) throw new NotFoundError(`This case has no ${what} number ${index + 1}`)
  return entry
}

/**
 * Strikes out or corrects a reading, with a reason. The stored list shows the reading as it now
 * stands (struck, or with its corrected figure and the one first entered); the timeline keeps the
 * correction as its own event, so nothing entered is ever lost. The ranking follows.
 */
export function planReadingCorrection(
  unit: UnitDto, current: CurrentCase,
  input: { index: number; action: 'strike' | 'correct'; reason: string; value?: number | boolean; unit?: ReadingUnit; confirmReason?: string },
  by: number, now: Date, atmosphericKpa: number,
): CaseChange {
  const reading = entryOf(current.readings, input.index, 'reading')
  if (reading.struck) throw new ConflictError('This reading is already struck out; enter the right figure as a new reading.')
  const revision: Revision = { at: now.toISOString(), by, reason: input.reason }
  const name = readingName(reading)
  if (input.action === 'strike') {
    const readings = current.readings.map((r, i) => (i === input.index ? { ...r, struck: revision } : r))
    return {
      changes: { readings },
      events: [{ type: 'reading-struck', payload: { index: input.index, quantity: reading.quantity, stage: reading.stage, value: reading.value, unit: reading.unit, reason: input.reason } }],
      rerank: true,
    }
  }
  const next: Reading = { quantity: reading.quantity, value: input.value!, unit: input.unit ?? reading.unit, ...(reading.stage ? { stage: reading.stage } : {}) }
  if (typeof next.value !== typeof reading.value) {
    throw new BadInputError(`${name} takes ${typeof reading.value === 'boolean' ? 'yes or no' : 'a number'}`, { value: [`${name} takes ${typeof reading.value === 'boolean' ? 'yes or no' : 'a number'}`] })
  }
  assertStagesOf(unit, [next], 'readings')
  // The same checks as a new reading: a correction cannot bring in an impossible figure either.
  const verdict = checkReadings(unit, [next], atmosphericKpa, input.confirmReason ? new Set([0]) : new Set())
  const impossible = verdict.impossible['readings.0.value']
  if (impossible) throw new ImplausibleInputError(impossible[0]!, { value: impossible })
  if (verdict.outsideEnvelope.length) {
    const message = verdict.outsideEnvelope[0]!.message
    throw new ConfirmationNeededError(`${message} Confirm it with a reason to keep it.`, { value: [message] }, [{ index: 0, message }])
  }
  const from = reading.corrected?.from ?? { value: reading.value, unit: reading.unit }
  const outside = input.confirmReason ? envelopeMessage(unit, next, atmosphericKpa) : undefined
  const { confirmedOutside: _dropped, ...rest } = reading
  const corrected: CaseReading = {
    ...rest, value: next.value, unit: next.unit, corrected: { ...revision, from },
    ...(outside && input.confirmReason ? { confirmedOutside: { message: outside, reason: input.confirmReason } } : {}),
  }
  return {
    changes: { readings: current.readings.map((r, i) => (i === input.index ? corrected : r)) },
    events: [{
      type: 'reading-corrected',
      payload: {
        index: input.index, quantity: reading.quantity, stage: reading.stage, value: next.value, unit: next.unit,
        from: { value: reading.value, unit: reading.unit }, reason: input.reason,
        text: `${name}: ${formatReading(reading)} corrected to ${formatReading(next)}`,
      },
    }],
    rerank: true,
  }
}

/** Strikes out or corrects a test outcome with a reason; the timeline keeps it as its own event. The ranking follows. */
export function planOutcomeCorrection(
  current: CurrentCase, input: { index: number; action: 'strike' | 'correct'; reason: string; outcome?: string }, by: number, now: Date,
): CaseChange {
  const result = entryOf(current.testResults, input.index, 'test outcome')
  if (result.struck) throw new ConflictError('This outcome is already struck out; record the test again instead.')
  const revision: Revision = { at: now.toISOString(), by, reason: input.reason }
  const base = { index: input.index, test: result.test, stage: result.stage, reason: input.reason }
  if (input.action === 'strike') {
    return {
      changes: { testResults: current.testResults.map((r, i) => (i === input.index ? { ...r, struck: revision } : r)) },
      events: [{ type: 'outcome-struck', payload: { ...base, outcome: result.outcome } }],
      rerank: true,
    }
  }
  const from = result.corrected?.from ?? { outcome: result.outcome }
  return {
    changes: { testResults: current.testResults.map((r, i) => (i === input.index ? { ...r, outcome: input.outcome!, corrected: { ...revision, from } } : r)) },
    events: [{ type: 'outcome-corrected', payload: { ...base, outcome: input.outcome, from: result.outcome } }],
    rerank: true,
  }
}

/**
 * A repair or verification step appended to the case, judged from its figures on its stage. The
 * step's cautions are those of its own kind, stage and refrigerant. Steps never move the diagnosis.
 */
export function planStep(unit: UnitDto & { stages: (UnitDto['stages'][number] & { designPressureKpa?: number | null })[] }, current: CurrentCase, input: RepairStepInput, by: number, now: Date, atmosphericKpa: number): CaseChange {
  assertStagesOf(unit, [input], 'step')
  const stage = unit.stages.find((s) => s.stage === input.stage)!
  const result = evaluateStep(input, { stage, atmosphericKpa })
  const steps = current.steps ?? []
  const record: RepairStepRecord = { index: steps.length, kind: input.kind, stage: input.stage, at: now.toISOString(), by, input, result }
  return {
    changes: { steps: [...steps, record] },
    events: [{ type: 'step-recorded', payload: { index: record.index, kind: input.kind, stage: input.stage, verdict: result.verdict, summary: result.summary } }],
    rerank: false,
  }
}

/** Strikes out a step recorded by mistake; the timeline keeps both. */
export function planStepStrike(current: CurrentCase, input: { index: number; reason: string }, by: number, now: Date): CaseChange {
  const steps = current.steps ?? []
  const step = entryOf(steps, input.index, 'step')
  if (step.struck) throw new ConflictError('This step is already struck out.')
  return {
    changes: { steps: steps.map((s, i) => (i === input.index ? { ...s, struck: { at: now.toISOString(), by, reason: input.reason } } : s)) },
    events: [{ type: 'step-struck', payload: { index: input.index, kind: step.kind, stage: step.stage, reason: input.reason } }],
    rerank: false,
  }
}

/** The photos of the case to show in its report; only the case's own uploads. */
export function planReportPhotos(caseUploadIds: readonly number[], uploadIds: number[]): { reportPhotoIds: number[]; events: NewEvent[] } {
  const own = new Set(caseUploadIds)
  const foreign = uploadIds.filter((id) => !own.has(id))
  if (foreign.length) {
    throw new BadInputError('Pick photos of this case only', Object.fromEntries(foreign.map((id) => [`uploadIds.${uploadIds.indexOf(id)}`, [`Upload ${id} is not a photo of this case`]])))
  }
  const reportPhotoIds = [...new Set(uploadIds)]
  return { reportPhotoIds, events: [{ type: 'report-photos-set', payload: { uploadIds: reportPhotoIds } }] }
}

/** A test outcome appended to the case; the ranking follows. */
export function planTestResult(
  unit: UnitDto,
  current: CurrentCase,
  result: { test: TestSlug; stage?: Stage; outcome: string; note?: string },
  by: number,
  now: Date,
): CaseChange {
  const { note, ...outcome } = result
  assertStagesOf(unit, [outcome], 'testResults')
  return {
    changes: { testResults: [...current.testResults, { ...outcome, at: now.toISOString(), by }] },
    events: [{ type: 'outcome-recorded', payload: { test: outcome.test, stage: outcome.stage, outcome: outcome.outcome, note } }],
    rerank: true,
  }
}

/** The full set of symptoms now ticked; the ranking follows. */
export function planSymptoms(symptoms: Symptom[]): CaseChange {
  const unique = [...new Set(symptoms)]
  return { changes: { symptoms: unique }, events: [{ type: 'symptoms-set', payload: { symptoms } }], rerank: true }
}

/** A note appended to the case's notes and timeline. */
export function planNote(current: CurrentCase, text: string): CaseChange {
  return { changes: { notes: current.notes ? `${current.notes}\n\n${text}` : text }, events: [{ type: 'note', payload: { text } }], rerank: false }
}

/** An addendum: the one thing a closed case still takes; an open case takes a note instead. */
export function planAddendum(current: Pick<CaseState, 'status'>, text: string): NewEvent[] {
  if (current.status !== 'closed') throw new ConflictError('An addendum is for closed cases; add a note to an open case instead')
  return [{ type: 'addendum', payload: { text } }]
}

export interface CloseInput {
  confirmedCauses: { cause: Cause; stage?: Stage; basis?: 'test' | 'repair' | 'judgement' }[]
  workDone: string
  parts?: string[]
  refrigerantTransactions?: { stage: Stage; refrigerant: string; grams: number; direction: 'added' | 'recovered'; cylinder?: string }[]
  unitStateAtDeparture?: string
  followUp?: string
}

/** Checks a closing record against the unit and returns what is stored. */
export function planClose(unit: UnitDto, input: CloseInput, closedBy: number | null): CaseClosure {
  const transactions = input.refrigerantTransactions ?? []
  assertStagesOf(unit, input.confirmedCauses, 'confirmedCauses')
  assertStagesOf(unit, transactions, 'refrigerantTransactions')
  const unknown = transactions.flatMap((t, i) => (isDesignation(t.refrigerant) ? [] : [i]))
  if (unknown.length) {
    const message = (i: number) => `${transactions[i]!.refrigerant} is not a refrigerant Rimecase knows`
    throw new BadInputError(
      unknown.map((i) => fieldMessage(['refrigerantTransactions', i, 'refrigerant'], message(i))).join('; '),
      Object.fromEntries(unknown.map((i) => [`refrigerantTransactions.${i}.refrigerant`, [message(i)]])),
    )
  }
  return {
    confirmedCauses: input.confirmedCauses,
    workDone: input.workDone,
    parts: input.parts ?? [],
    refrigerantTransactions: transactions.map((t): RefrigerantTransactionDto => ({ ...t, cylinder: t.cylinder ?? '' })),
    unitStateAtDeparture: input.unitStateAtDeparture ?? '',
    followUp: input.followUp ?? '',
    closedBy,
  }
}

/** Closing: the closure record, confirmed causes and the closing event; the last ranking stays as it was. */
export function planClosing(unit: UnitDto, input: CloseInput, by: number, now: Date): CaseChange & { closure: CaseClosure } {
  const closure = planClose(unit, input, by)
  return {
    closure,
    changes: { status: 'closed', closure, confirmedCauses: closure.confirmedCauses, closedAt: now },
    events: [{ type: 'case-closed', payload: { ...closure } }],
    rerank: false,
  }
}
