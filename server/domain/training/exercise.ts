// Exercises as data: the material copied from a closed case through an allow-list (never by
// deleting fields from the record), free text with every personal detail replaced, what the
// trainee sees at the start, the answers to their requests, and the path the engine would take.
// No I/O here.
import type { CaseReading, CaseTestResult } from '#shared/types/cases'
import type { Cause, Quantity, RankResponse, Stage, Symptom, TestResult, TestSlug } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import type { AttemptRequestDto, EngineStep, ExerciseDto, ExerciseReading, ExerciseStart, ExerciseTestChoice, ExerciseUnit } from '#shared/types/training'
import { latestReadings, latestTestResults } from '../cases/case-record'
import { InvalidStateError } from '../errors'
import { READING_MINUTES } from './scoring'

/** The invented names every exercise shows instead of the real ones. */
export const STAND_INS = { unit: 'Practice unit', customer: 'Practice customer', site: 'Practice site' } as const

/** Above this probability of its leading cause the engine stops testing. */
export const ENGINE_CONFIDENCE = 0.8

/** A test of the knowledge base as an exercise needs it. */
export interface ExerciseTestSource extends ExerciseTestChoice {
  outcomes: { outcome: string; label: string }[]
}

/** Everything an exercise keeps from its case: technical facts only. */
export interface ExerciseMaterial {
  unit: ExerciseUnit
  complaint: string
  symptoms: Symptom[]
  readings: ExerciseReading[]
  testResults: { test: TestSlug; stage?: Stage; outcome: string }[]
  confirmedCauses: { cause: Cause; stage?: Stage }[]
  tests: ExerciseTestSource[]
  causes: { cause: Cause; title: string }[]
  knowledgeBaseVersionId: number | string
  engine: { steps: EngineStep[]; minutes: number }
}

/** Personal details of a case: its customer, site and contacts, and the unit's serial and own names. */
export interface CaseSecrets {
  names: string[]
  addresses: string[]
  emails: string[]
  phones: string[]
  serials: string[]
}

const EMAIL = /[^\s@<>()]+@[^\s@<>()]+\.[a-z]{2,}/gi
// Seven or more digits with the usual separators: a telephone number, not a reading.
const PHONE = /\+?\(?\d[\d\s().\/-]{5,}\d/g
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')

/** Free text with every personal detail of the case replaced by a stand-in, and any e-mail or telephone-like number removed. */
export function scrubText(text: string, secrets: CaseSecrets): string {
  let out = text
  const replace = (values: string[], by: string) => {
    for (const v of [...values].filter((x) => x.trim().length >= 2).sort((a, b) => b.length - a.length)) out = out.replace(new RegExp(escape(v.trim()), 'gi'), by)
  }
  replace(secrets.emails, '[e-mail removed]')
  replace(secrets.phones, '[telephone removed]')
  replace(secrets.serials, '[serial removed]')
  replace(secrets.addresses, '[address removed]')
  replace(secrets.names, '[name removed]')
  out = out.replace(EMAIL, '[e-mail removed]')
  out = out.replace(PHONE, (m) => ((m.match(/\d/g)?.length ?? 0) >= 7 ? '[telephone removed]' : m))
  return out
}

/** The unit with stand-in names, copied field by field. */
export function exerciseUnit(unit: UnitDto): ExerciseUnit {
  return {
    name: STAND_INS.unit,
    customer: STAND_INS.customer,
    site: STAND_INS.site,
    kind: unit.kind,
    equipmentClass: unit.equipmentClass,
    siteAltitudeM: unit.siteAltitudeM,
    design: { cabinetC: unit.design.cabinetC, cascadeHxC: unit.design.cascadeHxC },
    stages: unit.stages.map((s) => ({
      stage: s.stage, refrigerant: s.refrigerant, chargeG: s.chargeG, volumeL: s.volumeL,
      referenceStandingPressureKpa: s.referenceStandingPressureKpa, referenceAmbientC: s.referenceAmbientC, ratedCurrentA: s.ratedCurrentA,
    })),
  }
}

/** A unit record the ranking can read, built from the exercise unit alone. */
export function rankableUnit(unit: ExerciseUnit): UnitDto {
  return {
    id: 0, name: unit.name, kind: unit.kind, equipmentClass: unit.equipmentClass, model: '', serial: '', location: '', customer: unit.customer, customerId: 0,
    site: unit.site, siteId: 0, siteAltitudeM: unit.siteAltitudeM, design: { ...unit.design }, stages: unit.stages.map((s) => ({ ...s, designPressureKpa: null })),
  }
}

const isDiagnosis = (x: { phase?: string }) => !x.phase || x.phase === 'diagnosis'

/** The diagnosis-phase facts a closed case recorded, latest of each, copied field by field. */
export function recordedFacts(readings: CaseReading[], testResults: CaseTestResult[]): Pick<ExerciseMaterial, 'readings' | 'testResults'> {
  return {
    readings: latestReadings(readings.filter(isDiagnosis)).map((r) => ({ quantity: r.quantity, ...(r.stage ? { stage: r.stage } : {}), value: r.value, unit: r.unit })),
    testResults: latestTestResults(testResults.filter(isDiagnosis)).map((t) => ({ test: t.test, ...(t.stage ? { stage: t.stage } : {}), outcome: t.outcome })),
  }
}

const sameSpot = (a: { stage?: Stage }, b: { stage?: Stage }) => (a.stage ?? null) === (b.stage ?? null)

/** The recorded reading of a quantity on a stage, if any. */
export function recordedReading(material: Pick<ExerciseMaterial, 'readings'>, quantity: Quantity, stage?: Stage): ExerciseReading | undefined {
  return material.readings.find((r) => r.quantity === quantity && sameSpot(r, { stage }))
}

/** The recorded outcome of a test on a stage, if any. */
export function recordedOutcome(material: Pick<ExerciseMaterial, 'testResults'>, test: TestSlug, stage?: Stage) {
  return material.testResults.find((t) => t.test === test && sameSpot(t, { stage }))
}

/** Refuses a start that names a reading the case never recorded (the trainee would see nothing). */
export function checkStart(material: Pick<ExerciseMaterial, 'readings'>, start: ExerciseStart): void {
  const missing = start.readings.filter((r) => !recordedReading(material, r.quantity, r.stage))
  if (missing.length) throw new InvalidStateError(`The case recorded no ${missing.map((m) => `${m.quantity}${m.stage ? ` (${m.stage})` : ''}`).join(', ')}: choose readings it recorded`)
}

/** What a trainee sees when they open the exercise. */
export function exerciseView(id: number, title: string, createdAt: Date, material: ExerciseMaterial, start: ExerciseStart): ExerciseDto {
  return {
    id,
    title,
    unit: material.unit,
    complaint: start.complaint ? material.complaint : null,
    symptoms: start.symptoms ? [...material.symptoms] : [],
    startReadings: start.readings.flatMap((r) => {
      const found = recordedReading(material, r.quantity, r.stage)
      return found ? [{ ...found }] : []
    }),
    tests: material.tests.map((t) => ({ test: t.test, title: t.title, minutes: t.minutes, opensSystem: t.opensSystem, hotWork: t.hotWork, stages: [...t.stages], safetyNotes: [...t.safetyNotes] })),
    causes: material.causes.map((c) => ({ cause: c.cause, title: c.title })),
    readingMinutes: READING_MINUTES,
    createdAt: createdAt.toISOString(),
  }
}

export type AttemptRequest = { kind: 'reading'; quantity: Quantity; stage?: Stage } | { kind: 'test'; test: TestSlug; stage?: Stage }

const sameRequest = (a: AttemptRequestDto, b: AttemptRequest) =>
  a.kind === b.kind && sameSpot(a, b) && (b.kind === 'reading' ? a.quantity === b.quantity : a.test === b.test)

/**
 * Answers a trainee's request from the case's record. Asking again for something already asked
 * costs nothing and adds nothing; a reading shown at the start is free.
 */
export function answerRequest(material: ExerciseMaterial, start: ExerciseStart, done: AttemptRequestDto[], request: AttemptRequest, now: Date): AttemptRequestDto | null {
  if (done.some((d) => sameRequest(d, request))) return null
  const stages = material.unit.stages.map((s) => s.stage)
  if (request.stage && !stages.includes(request.stage)) throw new InvalidStateError(`This unit has no ${request.stage} stage`)
  const at = now.toISOString()
  const where = request.stage ? { stage: request.stage } : {}
  if (request.kind === 'reading') {
    const shown = start.readings.some((r) => r.quantity === request.quantity && sameSpot(r, request))
    const found = recordedReading(material, request.quantity, request.stage)
    return {
      kind: 'reading', quantity: request.quantity, ...where, minutes: shown ? 0 : READING_MINUTES, found: !!found,
      ...(found ? { value: found.value, unit: found.unit } : {}), invasive: false, at,
    }
  }
  const test = material.tests.find((t) => t.test === request.test)
  if (!test) throw new InvalidStateError('This test is not in the knowledge base the exercise was made with')
  if (test.stages.length && (!request.stage || !test.stages.includes(request.stage))) throw new InvalidStateError(`Say which stage to run ${test.title} on`)
  const found = recordedOutcome(material, request.test, request.stage)
  const label = found ? test.outcomes.find((o) => o.outcome === found.outcome)?.label ?? found.outcome : undefined
  return {
    kind: 'test', test: request.test, ...where, minutes: test.minutes, found: !!found,
    ...(found ? { outcome: found.outcome, outcomeLabel: label } : {}), invasive: test.opensSystem || test.hotWork, at,
  }
}

/** The facts a trainee holds after their requests, as the ranking reads them. */
export function knownAfter(material: ExerciseMaterial, start: ExerciseStart, requests: { kind: string; quantity?: Quantity; test?: TestSlug; stage?: Stage }[]) {
  const readings = material.readings.filter((r) =>
    start.readings.some((s) => s.quantity === r.quantity && sameSpot(s, r)) || requests.some((q) => q.kind === 'reading' && q.quantity === r.quantity && sameSpot(q, r)))
  const testResults = material.testResults.filter((t) => requests.some((q) => q.kind === 'test' && q.test === t.test && sameSpot(q, t)))
  return { symptoms: start.symptoms ? material.symptoms : [], readings, testResults }
}

type Ranker = (known: { symptoms: Symptom[]; readings: ExerciseReading[]; testResults: TestResult[] }) => Promise<Pick<RankResponse, 'causes' | 'tests'>>

/**
 * The engine's path through the case: it takes every recorded reading the start did not show,
 * then the test it proposes first among those the case recorded, again and again, until its
 * leading cause passes ENGINE_CONFIDENCE or no recorded test is left to propose.
 */
export async function enginePath(material: Omit<ExerciseMaterial, 'engine'>, start: ExerciseStart, rank: Ranker): Promise<{ steps: EngineStep[]; minutes: number }> {
  const shown = (r: ExerciseReading) => start.readings.some((s) => s.quantity === r.quantity && sameSpot(s, r))
  const steps: EngineStep[] = material.readings.filter((r) => !shown(r)).map((r) => ({ kind: 'reading', quantity: r.quantity, ...(r.stage ? { stage: r.stage } : {}), minutes: READING_MINUTES }))
  const known = { symptoms: start.symptoms ? material.symptoms : [], readings: material.readings, testResults: [] as TestResult[] }
  for (let i = 0; i < material.testResults.length; i++) {
    const ranking = await rank(known)
    if ((ranking.causes[0]?.probability ?? 0) >= ENGINE_CONFIDENCE) break
    const next = ranking.tests
      .map((t) => ({ t, result: recordedOutcome(material, t.test, t.stage) ?? recordedOutcome(material, t.test) }))
      .find(({ t, result }) => result && !known.testResults.includes(result))
    if (!next) break
    known.testResults = [...known.testResults, next.result!]
    steps.push({ kind: 'test', test: next.t.test, ...(next.result!.stage ? { stage: next.result!.stage } : {}), minutes: next.t.minutes })
  }
  return { steps, minutes: steps.reduce((s, x) => s + x.minutes, 0) }
}
