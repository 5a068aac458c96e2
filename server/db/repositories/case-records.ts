// Reading a case record: the full record in one statement, its current state for a change, the
// case list with filters, and a unit's refrigerant log.
import { QueryTypes, type Transaction } from 'sequelize'
import type { CaseClosure, CaseDto, CaseEventDto, CaseListItem, CaseReading, CaseTestResult, EmailDto, RefrigerantTransactionDto } from '#shared/types/cases'
import type { RepairStepRecord } from '#shared/types/repair-steps'
import type { RankResponse, Symptom } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import type { CaseState } from '#server/domain/cases/case-record'
import { RefrigerantTransaction, ServiceCase } from '../models'
import { findUnit } from './equipment'
import { uploadUrls } from './uploads'

/** A case's current state with what a change needs besides it. */
export interface LockedCase extends CaseState {
  id: number
  organisationId: number
  unitId: number
  ranking: RankResponse | null
  notes: string
}

const iso = (d: Date | null) => (d ? d.toISOString() : null)

/** The unit of a case of the organisation, or null. */
export async function caseUnitId(organisationId: number, id: number): Promise<number | null> {
  const c = (await ServiceCase.findOne({ where: { id, organisationId }, attributes: ['unitId'], raw: true })) as { unitId: number } | null
  return c?.unitId ?? null
}

/**
 * The current state of a case of the organisation (null if absent). With a transaction it also
 * locks the row until that transaction ends.
 */
export async function readCaseState(organisationId: number, id: number, lockIn?: Transaction): Promise<LockedCase | null> {
  const c = (await ServiceCase.findOne({
    where: { id, organisationId }, raw: true, ...(lockIn ? { transaction: lockIn, lock: lockIn.LOCK.UPDATE } : {}),
  })) as ServiceCase | null
  if (!c) return null
  return {
    id: c.id, organisationId: c.organisationId, unitId: c.unitId, status: c.status, lockVersion: c.lockVersion,
    symptoms: c.symptoms as Symptom[], readings: c.readings as CaseReading[], testResults: c.testResults as CaseTestResult[],
    steps: (c.steps ?? []) as RepairStepRecord[], ranking: c.ranking as RankResponse | null, notes: c.notes,
  }
}

// One round trip for the whole record: the case row, its timeline with people's names, its
// refrigerant transactions, uploads and e-mails, each aggregated as JSON. This runs after every
// step a technician takes, so it is kept to a single statement.
const CASE_RECORD_SQL = `
SELECT c.id, c.unit_id, c.status, c.complaint, c.symptoms, c.readings, c.test_results, c.steps, c.report_photo_ids, c.ranking, c.lock_version,
       c.opened_at, c.closed_at, c.notes, c.closure, t.name AS technician,
       (SELECT coalesce(json_agg(json_build_object('id', e.id, 'at', e.at, 'type', e.type, 'byUserId', e.by_user_id, 'by', u.name, 'payload', e.payload) ORDER BY e.id), '[]')
          FROM case_events e LEFT JOIN users u ON u.id = e.by_user_id WHERE e.case_id = c.id) AS events,
       (SELECT coalesce(json_agg(json_build_object('id', r.id, 'stage', r.stage, 'refrigerant', r.refrigerant, 'grams', r.grams, 'direction', r.direction, 'cylinder', r.cylinder, 'at', r.at) ORDER BY r.id), '[]')
          FROM refrigerant_transactions r WHERE r.case_id = c.id) AS transactions,
       (SELECT coalesce(json_agg(json_build_object('id', f.id, 'mime', f.mime, 'bytes', f.bytes, 'originalName', f.original_name, 'purpose', f.purpose, 'thumbKey', f.thumb_key, 'createdAt', f.created_at) ORDER BY f.id), '[]')
          FROM uploads f WHERE f.case_id = c.id AND f.organisation_id = c.organisation_id) AS uploads,
       (SELECT coalesce(json_agg(json_build_object('id', m.id, 'toAddress', m.to_address, 'subject', m.subject, 'status', m.status, 'attempts', m.attempts, 'lastError', m.last_error, 'sentAt', m.sent_at, 'jobId', m.job_id) ORDER BY m.id), '[]')
          FROM outbound_emails m WHERE m.case_id = c.id AND m.organisation_id = c.organisation_id) AS emails
  FROM cases c LEFT JOIN users t ON t.id = c.technician_id
 WHERE c.id = :id AND c.organisation_id = :organisationId`

interface CaseRecordRow {
  id: number; unit_id: number; status: CaseDto['status']; complaint: string; symptoms: Symptom[]; readings: CaseReading[]
  test_results: CaseTestResult[]; steps: RepairStepRecord[]; report_photo_ids: number[]; ranking: RankResponse | null; lock_version: number; opened_at: Date; closed_at: Date | null
  notes: string; closure: CaseClosure | null; technician: string | null
  events: { id: number; at: string; type: CaseEventDto['type']; byUserId: number | null; by: string | null; payload: Record<string, unknown> }[]
  transactions: (Omit<RefrigerantTransactionDto, 'at'> & { at: string })[]
  uploads: { id: number; mime: string; bytes: number; originalName: string; purpose: string; thumbKey: string | null; createdAt: string }[]
  emails: (Omit<EmailDto, 'sentAt'> & { sentAt: string | null })[]
}

// Timestamps inside JSON come back as PostgreSQL text; the API speaks ISO 8601 in UTC.
const isoText = (t: string | null) => (t ? new Date(t).toISOString() : null)

/**
 * The full case record of the organisation, or null. `knownUnit` saves a query when the caller
 * already loaded the case's unit.
 */
export async function findCase(organisationId: number, id: number, knownUnit?: UnitDto): Promise<CaseDto | null> {
  const [c] = await ServiceCase.sequelize!.query<CaseRecordRow>(CASE_RECORD_SQL, { replacements: { id, organisationId }, type: QueryTypes.SELECT })
  if (!c) return null
  const unit = knownUnit && knownUnit.id === c.unit_id ? knownUnit : await findUnit(organisationId, c.unit_id)
  if (!unit) return null
  return {
    id: c.id,
    unitId: c.unit_id,
    status: c.status,
    complaint: c.complaint,
    symptoms: c.symptoms,
    readings: c.readings,
    testResults: c.test_results,
    ranking: c.ranking,
    events: c.events.map((e) => ({ ...e.payload, id: Number(e.id), at: isoText(e.at)!, type: e.type, by: e.by, byUserId: e.byUserId })),
    version: c.lock_version,
    technician: c.technician,
    openedAt: c.opened_at.toISOString(),
    closedAt: iso(c.closed_at),
    notes: c.notes,
    closure: c.closure,
    unit,
    transactions: c.transactions.map((t) => ({ ...t, at: isoText(t.at)! })),
    uploads: c.uploads.map(({ thumbKey, ...u }) => ({ ...u, ...uploadUrls(u.id, thumbKey), createdAt: isoText(u.createdAt)! })),
    emails: c.emails.map((m) => ({ ...m, sentAt: isoText(m.sentAt) })),
    steps: c.steps ?? [],
    reportPhotoIds: c.report_photo_ids ?? [],
  }
}

export interface CaseFilters {
  status?: 'open' | 'closed'
  customerId?: number
  unitId?: number
  technicianId?: number
  cause?: string
  from?: Date
  to?: Date
  q?: string
  sort: 'opened' | 'unit' | 'status'
  direction: 'asc' | 'desc'
  page: number
  pageSize: number
}

interface CaseListRow {
  id: number
  status: CaseListItem['status']
  complaint: string
  unit_id: number
  unit_name: string
  customer: string
  technician: string | null
  opened_at: Date
  closed_at: Date | null
  confirmed_causes: CaseListItem['confirmedCauses'] | null
  top_cause: { cause: CaseListItem['confirmedCauses'][number]['cause']; stage?: CaseListItem['confirmedCauses'][number]['stage']; probability: number } | null
  total: string
}

/**
 * One page of the organisation's cases, open ones first, with full-text search over complaint and
 * notes. One statement reads only the columns a row shows (the ranking's first cause comes from the
 * stored top_cause column, never the whole ranking), with the total of the filtered set beside it.
 */
export async function findCases(organisationId: number, f: CaseFilters): Promise<{ items: CaseListItem[]; total: number }> {
  const bind: unknown[] = [organisationId]
  const param = (value: unknown) => `$${bind.push(value)}`
  const where = ['c.organisation_id = $1']
  if (f.status) where.push(`c.status = ${param(f.status)}`)
  if (f.unitId) where.push(`c.unit_id = ${param(f.unitId)}`)
  if (f.technicianId) where.push(`c.technician_id = ${param(f.technicianId)}`)
  if (f.from) where.push(`c.opened_at >= ${param(f.from)}`)
  if (f.to) where.push(`c.opened_at <= ${param(f.to)}`)
  if (f.cause) where.push(`c.confirmed_causes @> ${param(JSON.stringify([{ cause: f.cause }]))}::jsonb`)
  if (f.q) where.push(`c.search @@ websearch_to_tsquery('english', ${param(f.q)})`)
  if (f.customerId) where.push(`s.customer_id = ${param(f.customerId)}`)
  const direction = f.direction === 'asc' ? 'ASC' : 'DESC'
  // Open cases first (the order of the cases_list_order index), then the chosen sort.
  const order = ["(c.status <> 'open')"]
  if (f.sort === 'unit') order.push(`u.name ${direction}`)
  else if (f.sort === 'status') order.push(`c.status ${direction}`)
  order.push(`c.opened_at ${f.sort === 'opened' ? direction : 'DESC'}`, 'c.id DESC')
  const from = `FROM cases c JOIN units u ON u.id = c.unit_id JOIN sites s ON s.id = u.site_id
    JOIN customers cu ON cu.id = s.customer_id LEFT JOIN users t ON t.id = c.technician_id
    WHERE ${where.join(' AND ')}`
  const filterBind = [...bind]
  const rows = await ServiceCase.sequelize!.query<CaseListRow>(
    `SELECT c.id, c.status, c.complaint, c.unit_id, u.name AS unit_name, cu.name AS customer, t.name AS technician,
            c.opened_at, c.closed_at, c.confirmed_causes, c.top_cause, count(*) OVER () AS total
     ${from} ORDER BY ${order.join(', ')} LIMIT ${param(f.pageSize)} OFFSET ${param((f.page - 1) * f.pageSize)}`,
    { bind, type: QueryTypes.SELECT },
  )
  // A page past the end has no row to carry the total.
  const total = rows.length
    ? Number(rows[0]!.total)
    : Number((await ServiceCase.sequelize!.query<{ n: string }>(`SELECT count(*) AS n ${from}`, { bind: filterBind, type: QueryTypes.SELECT }))[0]!.n)
  return {
    total,
    items: rows.map((c) => ({
      id: c.id, status: c.status, complaint: c.complaint, unitId: c.unit_id, unitName: c.unit_name, customer: c.customer,
      technician: c.technician, openedAt: c.opened_at.toISOString(), closedAt: c.closed_at ? c.closed_at.toISOString() : null,
      confirmedCauses: c.confirmed_causes ?? [],
      topCause: c.top_cause ? { cause: c.top_cause.cause, stage: c.top_cause.stage, probability: c.top_cause.probability } : null,
    })),
  }
}

/** Refrigerant log of a unit, newest first. */
export async function unitTransactions(organisationId: number, unitId: number): Promise<RefrigerantTransactionDto[]> {
  const rows = await RefrigerantTransaction.findAll({ where: { organisationId, unitId }, order: [['at', 'DESC']] })
  return rows.map((t) => ({ id: t.id, stage: t.stage as RefrigerantTransactionDto['stage'], refrigerant: t.refrigerant, grams: t.grams, direction: t.direction, cylinder: t.cylinder, at: t.at.toISOString() }))
}

