// The case record's use cases: opening a case, adding readings, outcomes, symptoms, notes and
// addenda, closing it. Each service function owns its transaction, its retries, the re-ranking
// and the timeline events; what a change may do is planned by the pure functions of
// server/domain/cases/case-changes.ts.
import type { Transaction } from 'sequelize'
import type { CacheStamps } from '#server/db/repositories/cache-stamps'
import { caseUnitId, findCase, findCases, readCaseState, type LockedCase } from '#server/db/repositories/case-records'
import { appendEvents, commitIfUnchanged, insertCase, insertTransactions, saveCase } from '#server/db/repositories/case-writes'
import { findUnit } from '#server/db/repositories/equipment'
import { certainlyNotApplied, isRetryableDbError, retryTransient } from '#server/db/transient'
import {
  assertWritable, planAddendum, planClosing, planNote, planOutcomeCorrection, planReadingCorrection, planReadings, planReportPhotos, planStep, planStepStrike,
  planSymptoms, planTestResult, type CaseChange,
} from '#server/domain/cases/case-changes'
import { rankingAsShown, rankingEvents, rankRequestFor, type NewEvent } from '#server/domain/cases/case-record'
import { ConflictError, NotFoundError } from '#server/domain/errors'
import type {
  AddReadingsInput, AddTestResultInput, CaseListQuery, CloseCaseInput, NewCaseInput, NoteInput, OutcomeCorrectionInput, ReadingCorrectionInput, SetSymptomsInput,
  StrikeInput,
} from '#shared/schemas/cases'
import type { AddRepairStepInput } from '#shared/schemas/repair-steps'
import { siteAtmosphere } from '#shared/utils/format'
import type { CaseDto, CaseListItem } from '#shared/types/cases'
import type { Page, UnitDto } from '#shared/types/equipment-dto'
import { rankInContext, rankingContext, stampsFor } from './diagnosis'
import { queueReportEmails } from './reports'
import type { Actor } from './types'

// A case never moves to another unit, so which unit it belongs to is kept for good.
const unitsOfCases = createCache<{ unitId: number }>('unit of each case', { max: 20_000 })
// A case's unit is read on every step of the case; the equipment generation in the key makes an
// edit of the unit (or its site) through any process a new key at once.
const units = createCache<UnitDto>('units by equipment generation', { max: 2_000 })

const CASE_NOT_FOUND = 'Case not found'

async function unitIdOfCase(organisationId: number, caseId: number): Promise<number> {
  const { unitId } = await unitsOfCases.load(`${organisationId}|${caseId}`, async () => {
    const found = await caseUnitId(organisationId, caseId)
    if (found === null) throw new NotFoundError(CASE_NOT_FOUND)
    return { unitId: found }
  })
  return unitId
}

/** A unit of the organisation as of `stamps`, or 404. */
export async function unitAsOf(stamps: CacheStamps, unitId: number): Promise<UnitDto> {
  return units.load(`${stamps.organisationId}|${unitId}|${stamps.equipmentGeneration}`, async () => {
    const unit = await findUnit(stamps.organisationId, unitId)
    if (!unit) throw new NotFoundError('Unit not found')
    return unit
  })
}

async function record(actor: Actor, caseId: number, unit?: UnitDto): Promise<CaseDto> {
  const found = await findCase(actor.organisationId, caseId, unit)
  if (!found) throw new NotFoundError(CASE_NOT_FOUND)
  return { ...found, ranking: rankingAsShown(found.status, found.ranking) }
}

/** `GET /api/cases/{id}`: the full record of a case of the actor's organisation, or 404. */
export function getCase(actor: Actor, input: { caseId: number }): Promise<CaseDto> {
  return record(actor, input.caseId)
}

/** `GET /api/cases`: one page of the organisation's cases, open ones first. */
export async function listCases(actor: Actor, query: CaseListQuery): Promise<Page<CaseListItem>> {
  const { items, total } = await findCases(actor.organisationId, query)
  return { items, total, page: query.page, pageSize: query.pageSize }
}

/** `POST /api/cases`: opens a case on a unit of the organisation, ranked from its symptoms. */
export async function openCase(actor: Actor, input: NewCaseInput, now: Date): Promise<CaseDto> {
  const stamps = await stampsFor(actor)
  const unit = await unitAsOf(stamps, input.unitId)
  const context = await rankingContext(stamps, { equipmentClass: unit.equipmentClass })
  const ranking = await rankInContext(context, rankRequestFor(unit, { symptoms: input.symptoms, readings: [], testResults: [] }))
  const id = await useDb().transaction(async (transaction) => {
    const caseId = await insertCase(
      { organisationId: actor.organisationId, unitId: unit.id, technicianId: actor.id, complaint: input.complaint, symptoms: input.symptoms, openedAt: now },
      [
        { type: 'case-opened', payload: { complaint: input.complaint, unitId: unit.id } },
        ...(input.symptoms.length ? [{ type: 'symptoms-set', payload: { symptoms: input.symptoms } }] : []),
        ...rankingEvents(null, ranking),
      ],
      transaction,
    )
    await saveCase(caseId, { ranking }, transaction)
    return caseId
  })
  unitsOfCases.set(`${actor.organisationId}|${id}`, { unitId: unit.id })
  return record(actor, id, unit)
}

type Planner<C extends CaseChange> = (current: LockedCase, unit: UnitDto) => C

/** Adds the new ranking and its events to a plan that asks to rank again. */
async function withRanking(change: CaseChange, current: LockedCase, unit: UnitDto, stamps: CacheStamps): Promise<CaseChange> {
  if (!change.rerank) return change
  const context = await rankingContext(stamps, { equipmentClass: unit.equipmentClass })
  const ranking = await rankInContext(context, rankRequestFor(unit, { ...current, ...change.changes }))
  return { ...change, changes: { ...change.changes, ranking }, events: [...change.events, ...rankingEvents(current.ranking, ranking)] }
}

/**
 * Applies one planned change to an open case. It commits optimistically in one statement guarded by
 * the case version; when another change landed in between, the step is planned again on the fresh
 * state (changes only append, so nothing is lost), unless the caller sent the version it saw: that
 * is a 409, never a silent merge.
 */
async function changeCase(actor: Actor, caseId: number, expectedVersion: number | undefined, now: Date, plan: Planner<CaseChange>): Promise<CaseDto> {
  const unitId = await unitIdOfCase(actor.organisationId, caseId)
  const stamps = await stampsFor(actor)
  const unit = await unitAsOf(stamps, unitId)
  for (let attempt = 0; attempt < 8; attempt++) {
    const current = await readCaseState(actor.organisationId, caseId)
    if (!current) throw new NotFoundError(CASE_NOT_FOUND)
    assertWritable(current, expectedVersion)
    const { changes, events } = await withRanking(plan(current, unit), current, unit, stamps)
    if (await commitIfUnchanged(caseId, current.lockVersion, changes, actor.id, events, now)) return record(actor, caseId, unit)
  }
  throw new ConflictError('This case is being changed by others right now. Reload it and enter your change again.')
}

/**
 * Applies a change that also writes other tables (closing) under a row lock, in one transaction.
 * Everything that needs the database besides the case row is loaded first, so the transaction
 * never waits for a second pooled connection.
 */
async function changeCaseLocked<C extends CaseChange>(
  actor: Actor,
  caseId: number,
  expectedVersion: number | undefined,
  now: Date,
  plan: Planner<C>,
  alsoWrite: (transaction: Transaction, unit: UnitDto, change: C) => Promise<NewEvent[]>,
): Promise<CaseDto> {
  const unitId = await unitIdOfCase(actor.organisationId, caseId)
  const unit = await unitAsOf(await stampsFor(actor), unitId)
  // A passing failure before the commit rolled everything back, so the whole transaction is tried
  // again; a failure of the commit itself leaves its outcome unknown and is not repeated.
  let committing = false
  await retryTransient(() => useDb().transaction(async (transaction) => {
    committing = false
    const current = await readCaseState(actor.organisationId, caseId, transaction)
    if (!current) throw new NotFoundError(CASE_NOT_FOUND)
    assertWritable(current, expectedVersion)
    const change = plan(current, unit)
    const more = await alsoWrite(transaction, unit, change)
    await appendEvents(caseId, actor.id, [...change.events, ...more], transaction, now)
    await saveCase(caseId, change.changes, transaction)
    committing = true
  }), { retryable: (error) => isRetryableDbError(error) && (!committing || certainlyNotApplied(error)) })
  return record(actor, caseId, unit)
}

const atmosphereOf = (unit: UnitDto) => siteAtmosphere(unit.siteAltitudeM).kpa

/**
 * `POST /api/cases/{id}/readings`: appends readings and re-ranks. Impossible readings are a 422 and
 * readings far outside the unit's design envelope a 422 until confirmed; the case is then unchanged.
 */
export function addReadings(actor: Actor, input: AddReadingsInput & { caseId: number }, now: Date): Promise<CaseDto> {
  return changeCase(actor, input.caseId, input.version, now, (current, unit) =>
    planReadings(unit, current, input.readings, actor.id, now, { atmosphericKpa: atmosphereOf(unit), confirmations: input.confirmations }))
}

/** `POST /api/cases/{id}/readings/{index}/correction`: strikes out or corrects a reading with a reason, and re-ranks. */
export function correctReading(actor: Actor, input: ReadingCorrectionInput & { caseId: number; index: number }, now: Date): Promise<CaseDto> {
  const { caseId, version, ...correction } = input
  return changeCase(actor, caseId, version, now, (current, unit) => planReadingCorrection(unit, current, correction, actor.id, now, atmosphereOf(unit)))
}

/** `POST /api/cases/{id}/outcomes/{index}/correction`: strikes out or corrects a test outcome with a reason, and re-ranks. */
export function correctOutcome(actor: Actor, input: OutcomeCorrectionInput & { caseId: number; index: number }, now: Date): Promise<CaseDto> {
  const { caseId, version, ...correction } = input
  return changeCase(actor, caseId, version, now, (current) => planOutcomeCorrection(current, correction, actor.id, now))
}

/** `POST /api/cases/{id}/steps`: records a repair or verification step with its figures and verdict. */
export function addRepairStep(actor: Actor, input: AddRepairStepInput & { caseId: number }, now: Date): Promise<CaseDto> {
  return changeCase(actor, input.caseId, input.version, now, (current, unit) => planStep(unit, current, input.step, actor.id, now, atmosphereOf(unit)))
}

/** `POST /api/cases/{id}/steps/{index}/strike`: strikes out a step recorded by mistake. */
export function strikeRepairStep(actor: Actor, input: StrikeInput & { caseId: number; index: number }, now: Date): Promise<CaseDto> {
  return changeCase(actor, input.caseId, input.version, now, (current) => planStepStrike(current, input, actor.id, now))
}

/** `PUT /api/cases/{id}/report/photos`: the photos of the case shown in its report and PDF (open or closed case). */
export async function setReportPhotos(actor: Actor, input: { caseId: number; uploadIds: number[] }, now: Date): Promise<CaseDto> {
  const found = await record(actor, input.caseId)
  const images = found.uploads.filter((u) => u.mime.startsWith('image/')).map((u) => u.id)
  const { reportPhotoIds, events } = planReportPhotos(images, input.uploadIds)
  await useDb().transaction(async (transaction) => {
    await saveCase(input.caseId, { reportPhotoIds }, transaction)
    await appendEvents(input.caseId, actor.id, events, transaction, now)
  })
  return record(actor, input.caseId, found.unit)
}

/** `POST /api/cases/{id}/test-results`: records a test outcome and re-ranks. */
export function recordTestResult(actor: Actor, input: AddTestResultInput & { caseId: number }, now: Date): Promise<CaseDto> {
  const { caseId, version, ...result } = input
  return changeCase(actor, caseId, version, now, (current, unit) => planTestResult(unit, current, result, actor.id, now))
}

/** `PUT /api/cases/{id}/symptoms`: replaces the ticked symptoms and re-ranks. */
export function setSymptoms(actor: Actor, input: SetSymptomsInput & { caseId: number }, now: Date): Promise<CaseDto> {
  return changeCase(actor, input.caseId, input.version, now, () => planSymptoms(input.symptoms))
}

/** `POST /api/cases/{id}/notes`: adds a note to an open case. */
export function addNote(actor: Actor, input: NoteInput & { caseId: number }, now: Date): Promise<CaseDto> {
  return changeCase(actor, input.caseId, input.version, now, (current) => planNote(current, input.text))
}

/** `POST /api/cases/{id}/addendum`: the one thing a closed case still takes. */
export async function addAddendum(actor: Actor, input: NoteInput & { caseId: number }, now: Date): Promise<CaseDto> {
  await useDb().transaction(async (transaction) => {
    const current = await readCaseState(actor.organisationId, input.caseId, transaction)
    if (!current) throw new NotFoundError(CASE_NOT_FOUND)
    await appendEvents(input.caseId, actor.id, planAddendum(current, input.text), transaction, now)
  })
  return record(actor, input.caseId)
}

/**
 * `POST /api/cases/{id}/close`: stores the findings and refrigerant transactions, and queues the
 * service report to the site's report contacts, all in one transaction. Delivery runs as
 * background jobs, so closing never waits for, or fails because of, e-mail.
 */
export function closeCase(actor: Actor, input: CloseCaseInput & { caseId: number }, now: Date): Promise<CaseDto> {
  const { caseId, version, sendReport, ...closing } = input
  return changeCaseLocked(actor, caseId, version, now, (_current, unit) => planClosing(unit, closing, actor.id, now), async (transaction, unit, change) => {
    await insertTransactions(
      { organisationId: actor.organisationId, caseId, unitId: unit.id, byUserId: actor.id, at: now }, change.closure.refrigerantTransactions, transaction,
    )
    return sendReport === false ? [] : (await queueReportEmails(actor, { caseId, unit }, transaction)).events
  })
}
