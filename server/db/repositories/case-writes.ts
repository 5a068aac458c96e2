// The write path of a case: opening it, appending to its timeline, saving a change (optimistically
// in one statement, or under a row lock) and recording refrigerant transactions.
import type { Transaction } from 'sequelize'
import type { RefrigerantTransactionDto } from '#shared/types/cases'
import type { Symptom } from '#shared/types/diagnosis'
import type { CaseFieldChanges } from '#server/domain/cases/case-changes'
import type { NewEvent } from '#server/domain/cases/case-record'
import { CaseEvent, RefrigerantTransaction, ServiceCase } from '../models'
import { linkCylinders } from './refrigerant-log'
import { certainlyNotApplied, retryTransient } from '../transient'

/** Opens a case on a unit of the organisation; returns its id. */
export async function insertCase(
  input: { organisationId: number; unitId: number; technicianId: number; complaint: string; symptoms: Symptom[]; openedAt?: Date },
  events: NewEvent[],
  transaction: Transaction,
): Promise<number> {
  const created = await ServiceCase.create(
    { ...input, ranking: null, closure: null, closedAt: null, openedAt: input.openedAt ?? new Date() },
    { transaction },
  )
  await appendEvents(created.id, input.technicianId, events, transaction, input.openedAt)
  return created.id
}

/** Appends timeline events; the table itself refuses later edits. */
export async function appendEvents(caseId: number, byUserId: number | null, events: NewEvent[], transaction: Transaction, at?: Date) {
  if (!events.length) return
  // Every step of every case passes here, so it is one plain multi-row INSERT.
  const bind: unknown[] = []
  const rows = events.map((e) => {
    bind.push(caseId, byUserId, e.type, JSON.stringify(e.payload), at ?? new Date())
    const n = bind.length
    return `($${n - 4}, $${n - 3}, $${n - 2}, $${n - 1}::jsonb, $${n})`
  })
  await CaseEvent.sequelize!.query(`INSERT INTO case_events (case_id, by_user_id, type, payload, at) VALUES ${rows.join(', ')}`, { bind, transaction })
}

/** Saves changed fields of a locked case and bumps its version. */
export async function saveCase(id: number, changes: CaseFieldChanges, transaction: Transaction) {
  const bind: unknown[] = [id]
  const sets = setClauses(changes, bind)
  await ServiceCase.sequelize!.query(`UPDATE cases SET ${sets} WHERE id = $1`, { bind, transaction })
}

const COLUMNS: Record<string, string> = {
  symptoms: 'symptoms', readings: 'readings', testResults: 'test_results', ranking: 'ranking', notes: 'notes', status: 'status',
  closure: 'closure', confirmedCauses: 'confirmed_causes', closedAt: 'closed_at', steps: 'steps', reportPhotoIds: 'report_photo_ids',
}
const JSON_COLUMNS = new Set(['symptoms', 'readings', 'testResults', 'ranking', 'closure', 'confirmedCauses', 'steps', 'reportPhotoIds'])

/** SET clauses of a plain UPDATE: JSON columns go as JSON text, and the version goes up with them. */
function setClauses(changes: CaseFieldChanges, bind: unknown[]): string {
  const sets = Object.entries(changes).map(([key, value]) => {
    bind.push(JSON_COLUMNS.has(key) ? JSON.stringify(value) : value)
    return `${COLUMNS[key]} = $${bind.length}${JSON_COLUMNS.has(key) ? '::jsonb' : ''}`
  })
  return [...sets, 'lock_version = lock_version + 1', 'updated_at = now()'].join(', ')
}

/**
 * Saves a change and appends its events in one statement, only if the case is still open and at
 * `lockVersion` (optimistic concurrency). Returns false when someone changed it first.
 *
 * A passing database failure (a dropped connection, a restart, a serialization failure) is retried
 * with a short, bounded backoff. When the statement was cut while it ran, its outcome is unknown:
 * before trying again the case is read, and a version that moved on with this change's first
 * event in the timeline means it did land, so it is never written twice.
 */
export async function commitIfUnchanged(
  id: number, lockVersion: number, changes: CaseFieldChanges, byUserId: number | null, events: NewEvent[], at: Date,
): Promise<boolean> {
  if (!events.length) throw new Error('A case change always records at least one event')
  const bind: unknown[] = [id, lockVersion]
  const sets = setClauses(changes, bind)
  const rows = events.map((e) => {
    bind.push(byUserId, e.type, JSON.stringify(e.payload), at)
    const n = bind.length
    return `($${n - 3}::int, $${n - 2}::text, $${n - 1}::jsonb, $${n}::timestamptz)`
  })
  let outcomeUnknown = false
  return retryTransient(async () => {
    if (outcomeUnknown) {
      const landed = await landedBefore(id, lockVersion, byUserId, events[0]!, at)
      if (landed !== undefined) return landed
    }
    try {
      const [inserted] = await ServiceCase.sequelize!.query(
        `WITH upd AS (UPDATE cases SET ${sets} WHERE id = $1 AND lock_version = $2 AND status = 'open' RETURNING id)
         INSERT INTO case_events (case_id, by_user_id, type, payload, at)
         SELECT upd.id, v.by_user_id, v.type, v.payload, v.at FROM upd, (VALUES ${rows.join(', ')}) AS v(by_user_id, type, payload, at)
         RETURNING case_events.id`,
        { bind },
      )
      return (inserted as unknown[]).length > 0
    } catch (error) {
      outcomeUnknown ||= !certainlyNotApplied(error)
      throw error
    }
  })
}

/**
 * After a commit whose outcome is unknown: undefined when the case is still at `lockVersion` (it did
 * not land, try again); true when the version moved and the change's first event is in the
 * timeline (it landed); false when someone else's change moved it (plan again on the fresh state).
 */
async function landedBefore(id: number, lockVersion: number, byUserId: number | null, first: NewEvent, at: Date): Promise<boolean | undefined> {
  const [rows] = await ServiceCase.sequelize!.query(
    `SELECT c.lock_version AS version,
            EXISTS (SELECT 1 FROM case_events e WHERE e.case_id = c.id AND e.type = $2 AND e.payload = $3::jsonb AND e.at = $4
                    AND e.by_user_id IS NOT DISTINCT FROM $5::int) AS landed
       FROM cases c WHERE c.id = $1`,
    { bind: [id, first.type, JSON.stringify(first.payload), at, byUserId] },
  )
  const row = (rows as { version: number; landed: boolean }[])[0]
  if (!row || row.version === lockVersion) return undefined
  return row.landed
}

/** Records refrigerant added to or recovered from a unit's stages. */
export async function insertTransactions(
  base: { organisationId: number; caseId: number; unitId: number; byUserId: number | null; at?: Date },
  items: RefrigerantTransactionDto[],
  transaction: Transaction,
) {
  await RefrigerantTransaction.bulkCreate(
    items.map((t) => ({ ...base, stage: t.stage, refrigerant: t.refrigerant, grams: t.grams, direction: t.direction, cylinder: t.cylinder, at: base.at ?? new Date() })),
    { transaction },
  )
  // The cylinders named become records, so recovered refrigerant can be followed to its cylinder.
  if (items.some((t) => t.cylinder.trim())) await linkCylinders(base.organisationId, transaction)
}

