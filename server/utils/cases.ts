import type { H3Event } from 'h3'
import type { Transaction } from 'sequelize'
import type { User } from '#auth-utils'
import { appendEvents, caseUnitId, commitIfUnchanged, findCase, readCaseState, saveCase, type LockedCase } from '#server/db/repositories/cases'
import { findUnit } from '#server/db/repositories/equipment'
import { assertWritable, rankingEvents, rankRequestFor, type NewEvent } from '#server/domain/cases/case-record'
import type { CaseDto } from '#shared/types/cases'
import type { RankResponse } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'

// A case's unit is read on every step of the case but changes rarely: keep it a few seconds.
// Editing a unit drops the entry at once in this process; other workers see it within TTL.
const units = new Map<string, { unit: UnitDto; until: number }>()
const UNIT_TTL_MS = 5_000

/** The unit of the organisation, from a short-lived cache. */
export async function cachedUnit(organisationId: number, unitId: number): Promise<UnitDto | null> {
  const key = `${organisationId}|${unitId}`
  const hit = units.get(key)
  if (hit && hit.until > Date.now()) return hit.unit
  const unit = await findUnit(organisationId, unitId)
  if (unit) units.set(key, { unit, until: Date.now() + UNIT_TTL_MS })
  return unit
}

// A case never moves to another unit, so which unit it belongs to is remembered for good.
const caseUnits = new Map<string, number>()
async function unitOfCase(organisationId: number, caseId: number): Promise<number | null> {
  const key = `${organisationId}|${caseId}`
  const known = caseUnits.get(key)
  if (known !== undefined) return known
  const unitId = await caseUnitId(organisationId, caseId)
  if (caseUnits.size > 20_000) caseUnits.clear()
  if (unitId !== null) caseUnits.set(key, unitId)
  return unitId
}

/** Forgets a cached unit after it was edited. */
export function forgetCachedUnit(organisationId: number, unitId: number) {
  units.delete(`${organisationId}|${unitId}`)
}

/** The case of the user's organisation, or 404. */
export async function caseOr404(user: User, id: number, knownUnit?: UnitDto): Promise<CaseDto> {
  const found = await findCase(user.organisationId, id, knownUnit)
  if (!found) throw notFound('Case')
  return found
}

export interface CaseChange {
  changes: Parameters<typeof saveCase>[1]
  events: NewEvent[]
  rerank?: boolean
}

/**
 * Applies one change to an open case: refuses closed cases and stale versions (409), appends the
 * change's events, re-ranks when asked, and returns the updated record.
 *
 * Readings, outcomes, symptoms and notes commit optimistically in one statement guarded by the case
 * version; if another change landed in between, the step is planned again on the fresh state (they
 * only append, so nothing is lost) unless the caller sent the version it saw, which then gets 409.
 * Closing (`locked`) also writes other tables, so it takes a row lock in a transaction instead.
 */
export async function changeCase(
  event: H3Event,
  user: User,
  id: number,
  expectedVersion: number | undefined,
  plan: (current: LockedCase, unit: UnitDto, transaction?: Transaction) => CaseChange | Promise<CaseChange>,
  options: { locked?: boolean } = {},
): Promise<CaseDto> {
  // Everything that needs the database besides the case row is loaded first, so a request never
  // holds one pooled connection while waiting for another.
  const unitId = await unitOfCase(user.organisationId, id)
  if (unitId === null) throw notFound('Case')
  const unit = await cachedUnit(user.organisationId, unitId)
  if (!unit) throw notFound('Unit')
  const rank = await prepareRanker(user.organisationId, { equipmentClass: unit.equipmentClass })

  const planned = async (current: LockedCase, transaction?: Transaction) => {
    assertWritable(current, expectedVersion)
    const { changes, events, rerank } = await plan(current, unit, transaction)
    if (!rerank) return { changes, events }
    const ranking = await rank(rankRequestFor(unit, { ...current, ...changes }))
    return { changes: { ...changes, ranking }, events: [...events, ...rankingEvents(current.ranking, ranking)] }
  }

  if (options.locked) {
    await useDb().transaction(async (transaction) => {
      const current = await readCaseState(user.organisationId, id, transaction)
      if (!current) throw notFound('Case')
      await withDomainErrors(async () => {
        const { changes, events } = await planned(current, transaction)
        await appendEvents(id, user.id, events, transaction)
        await saveCase(id, changes, transaction)
      })
    })
    return caseOr404(user, id, unit)
  }

  for (let attempt = 0; attempt < 8; attempt++) {
    const current = await readCaseState(user.organisationId, id)
    if (!current) throw notFound('Case')
    const committed = await withDomainErrors(async () => {
      const { changes, events } = await planned(current)
      return commitIfUnchanged(id, current.lockVersion, changes, user.id, events)
    })
    if (committed) return caseOr404(user, id, unit)
  }
  throw createError({ status: 409, statusText: 'Conflict', message: 'This case is being changed by others right now. Reload it and enter your change again.' })
}
