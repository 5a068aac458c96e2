// Rules of a service case as plain functions: what a change may do, what it appends to the
// timeline, and how the case turns into a ranking request. No I/O here.
import type { CaseClosure, CaseReading, CaseTestResult } from '#shared/types/cases'
import type { RankRequest, RankResponse, Reading, Stage, Symptom, TestResult } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { isDesignation } from '#shared/utils/properties'
import { ConflictError, InvalidStateError } from '../errors'

export interface CaseState {
  status: 'open' | 'closed'
  lockVersion: number
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
}

export interface NewEvent {
  type: string
  payload: Record<string, unknown>
}

/** Refuses a change to a closed case, or one based on an outdated version of it. */
export function assertWritable(state: CaseState, expectedVersion: number | undefined): void {
  if (state.status === 'closed') {
    throw new ConflictError('This case is closed. Add an addendum instead of changing the record.')
  }
  if (expectedVersion !== undefined && expectedVersion !== state.lockVersion) {
    throw new ConflictError(
      `This case was changed by someone else (your copy is version ${expectedVersion}, the case is at version ${state.lockVersion}). Reload to see their changes, then enter yours again.`,
    )
  }
}

/** Stages a unit actually has; a reading or result for another stage is refused. */
export function checkStages(unit: UnitDto, items: { stage?: Stage }[], what: string): string[] {
  const stages = new Set(unit.stages.map((s) => s.stage))
  return items
    .map((item, i) => (item.stage && !stages.has(item.stage) ? `${what}[${i}].stage: "${item.stage}" is not a stage of ${unit.name}; allowed: ${[...stages].join(', ')}` : ''))
    .filter(Boolean)
}

/** The latest reading of each quantity and stage: what the unit shows now. */
export function latestReadings(readings: CaseReading[]): Reading[] {
  const latest = new Map<string, Reading>()
  for (const { at: _at, by: _by, ...reading } of readings) latest.set(`${reading.quantity}|${reading.stage ?? ''}`, reading)
  return [...latest.values()]
}

/** The latest outcome of each test and stage. */
export function latestTestResults(results: CaseTestResult[]): TestResult[] {
  const latest = new Map<string, TestResult>()
  for (const { at: _at, by: _by, ...result } of results) latest.set(`${result.test}|${result.stage ?? ''}`, result)
  return [...latest.values()]
}

/** Builds the diagnosis request of a case from its unit's nameplate and what was observed. */
export function rankRequestFor(unit: UnitDto, state: Pick<CaseState, 'symptoms' | 'readings' | 'testResults'>): RankRequest {
  const design: NonNullable<RankRequest['unit']['design']> = {}
  if (unit.design.cabinetC !== null) design.cabinetC = unit.design.cabinetC
  if (unit.design.cascadeHxC !== null) design.cascadeHxC = unit.design.cascadeHxC
  return {
    unit: {
      kind: unit.kind,
      stages: unit.stages.map((s) => {
        const stage: RankRequest['unit']['stages'][number] = { stage: s.stage, refrigerant: s.refrigerant }
        if (s.chargeG !== null) stage.chargeG = s.chargeG
        if (s.volumeL !== null) stage.volumeL = s.volumeL
        if (s.referenceStandingPressureKpa !== null) stage.referenceStandingPressureKpa = s.referenceStandingPressureKpa
        if (s.referenceAmbientC !== null) stage.referenceAmbientC = s.referenceAmbientC
        if (s.ratedCurrentA !== null) stage.ratedCurrentA = s.ratedCurrentA
        return stage
      }),
      design,
    },
    site: { altitudeM: unit.siteAltitudeM },
    symptoms: state.symptoms,
    readings: latestReadings(state.readings),
    testResults: latestTestResults(state.testResults),
  }
}

/** Events that record a new ranking: the snapshot, and the proposal when the best test changed. */
export function rankingEvents(previous: RankResponse | null, next: RankResponse): NewEvent[] {
  const top = next.causes.slice(0, 3).map((c) => ({ cause: c.cause, stage: c.stage, probability: c.probability }))
  const events: NewEvent[] = [
    { type: 'ranking-snapshot', payload: { knowledgeBaseVersion: next.knowledgeBaseVersion, top, warnings: next.warnings } },
  ]
  const best = next.tests[0]
  const before = previous?.tests[0]
  if (best && (!before || before.test !== best.test || before.stage !== best.stage)) {
    events.push({ type: 'test-proposed', payload: { test: best.test, stage: best.stage, expectedGain: best.expectedGain, minutes: best.minutes } })
  }
  return events
}

export interface CloseInput {
  confirmedCauses: { cause: CaseClosure['confirmedCauses'][number]['cause']; stage?: Stage }[]
  workDone: string
  parts?: string[]
  refrigerantTransactions?: { stage: Stage; refrigerant: string; grams: number; direction: 'added' | 'recovered'; cylinder?: string }[]
  unitStateAtDeparture?: string
  followUp?: string
}

/** Checks a closing record against the unit and returns what is stored. */
export function planClose(unit: UnitDto, input: CloseInput, closedBy: number | null): CaseClosure {
  const problems = [
    ...checkStages(unit, input.confirmedCauses, 'confirmedCauses'),
    ...checkStages(unit, input.refrigerantTransactions ?? [], 'refrigerantTransactions'),
  ]
  ;(input.refrigerantTransactions ?? []).forEach((t, i) => {
    if (!isDesignation(t.refrigerant)) problems.push(`refrigerantTransactions[${i}].refrigerant: unknown refrigerant "${t.refrigerant}"`)
  })
  if (problems.length) throw new InvalidStateError(problems.join('; '))
  return {
    confirmedCauses: input.confirmedCauses,
    workDone: input.workDone,
    parts: input.parts ?? [],
    refrigerantTransactions: (input.refrigerantTransactions ?? []).map((t) => ({ ...t, cylinder: t.cylinder ?? '' })),
    unitStateAtDeparture: input.unitStateAtDeparture ?? '',
    followUp: input.followUp ?? '',
    closedBy,
  }
}
