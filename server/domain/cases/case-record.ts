// A service case as data: its state, the events of its timeline, and how it turns into a ranking
// request. What a change may do is planned in case-changes.ts. No I/O here.
import type { CaseReading, CaseTestResult } from '#shared/types/cases'
import type { RepairStepRecord } from '#shared/types/repair-steps'
import type { RankRequest, RankResponse, Reading, Symptom, TestResult } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { siteAtmosphere } from '#shared/utils/format'

export interface CaseState {
  status: 'open' | 'closed'
  lockVersion: number
  symptoms: Symptom[]
  readings: CaseReading[]
  testResults: CaseTestResult[]
  /** Repair and verification steps; absent in states read before steps existed. */
  steps?: RepairStepRecord[]
}

export interface NewEvent {
  type: string
  payload: Record<string, unknown>
}

/**
 * The latest reading of each quantity, stage and phase: what the unit showed at each point of the
 * job. Struck-out readings are left out; corrected ones count with their corrected figure.
 */
export function latestReadings(readings: CaseReading[]): Reading[] {
  const latest = new Map<string, Reading>()
  for (const r of readings) {
    if (r.struck) continue
    const reading: Reading = { quantity: r.quantity, value: r.value, unit: r.unit }
    if (r.stage) reading.stage = r.stage
    if (r.phase) reading.phase = r.phase
    latest.set(`${reading.quantity}|${reading.stage ?? ''}|${reading.phase ?? 'diagnosis'}`, reading)
  }
  return [...latest.values()]
}

/** The latest outcome of each test, stage and phase; struck-out outcomes are left out. */
export function latestTestResults(results: CaseTestResult[]): TestResult[] {
  const latest = new Map<string, TestResult>()
  for (const r of results) {
    if (r.struck) continue
    const result: TestResult = { test: r.test, outcome: r.outcome }
    if (r.stage) result.stage = r.stage
    if (r.phase) result.phase = r.phase
    latest.set(`${result.test}|${result.stage ?? ''}|${result.phase ?? ''}`, result)
  }
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
        if (s.meteringDevice) stage.meteringDevice = s.meteringDevice
        return stage
      }),
      design,
    },
    // The one atmosphere-from-altitude rule of the app, so the diagnosis reads gauges as every screen does.
    site: { altitudeM: unit.siteAltitudeM, atmosphericKpa: siteAtmosphere(unit.siteAltitudeM).kpa },
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

/**
 * The ranking as a case shows it: a closed case keeps the causes as they stood when it was closed,
 * but proposes no next test, since nobody will take one on a case that is finished.
 */
export function rankingAsShown(status: CaseState['status'], ranking: RankResponse | null): RankResponse | null {
  if (!ranking || status === 'open') return ranking
  return { ...ranking, tests: [] }
}
