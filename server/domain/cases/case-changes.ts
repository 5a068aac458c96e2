// What each change to a case may do, as plain functions: current state and input in, the fields to
// save and the timeline events to append out. The case service loads the state, calls one planner,
// re-ranks when the plan asks, and commits. No I/O here.
import type { CaseClosure, CaseReading, CaseTestResult, RefrigerantTransactionDto } from '#shared/types/cases'
import type { Cause, RankResponse, Reading, Stage, Symptom, TestSlug } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { isDesignation } from '#shared/utils/properties'
import { fieldMessage, stageLabel, stageList } from '#shared/utils/vocabulary'
import { BadInputError, ConflictError } from '../errors'
import type { CaseState, NewEvent } from './case-record'

/** Columns a case change may set. */
export type CaseFieldChanges = Partial<{
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
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

/** Readings appended to the case, each stamped with when and by whom; the ranking follows. */
export function planReadings(unit: UnitDto, current: CurrentCase, readings: Reading[], by: number, now: Date): CaseChange {
  assertStagesOf(unit, readings, 'readings')
  const at = now.toISOString()
  const added = readings.map((r) => ({ ...r, at, by }))
  return {
    changes: { readings: [...current.readings, ...added] },
    events: added.map((r) => ({ type: 'reading-entered', payload: { quantity: r.quantity, stage: r.stage, value: r.value, unit: r.unit } })),
    rerank: true,
  }
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
  confirmedCauses: { cause: Cause; stage?: Stage }[]
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
