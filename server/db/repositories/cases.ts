import { Op, QueryTypes, type Transaction, type WhereOptions } from 'sequelize'
import type { CaseClosure, CaseDto, CaseEventDto, CaseListItem, CaseReading, CaseTestResult, EmailDto, RefrigerantTransactionDto, UploadDto } from '#shared/types/cases'
import type { RankResponse, Symptom } from '#shared/types/diagnosis'
import type { CaseState, NewEvent } from '#server/domain/cases/case-record'
import { CaseEvent, Customer, OutboundEmail, RefrigerantTransaction, ServiceCase, Site, Unit, Upload, User } from '../models'
import type { UnitDto } from '#shared/types/equipment-dto'
import { findUnit } from './equipment'

export interface LockedCase extends CaseState {
  id: number
  organisationId: number
  unitId: number
  ranking: RankResponse | null
}

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

/** The unit of a case of the organisation, or null. */
export async function caseUnitId(organisationId: number, id: number): Promise<number | null> {
  const c = (await ServiceCase.findOne({ where: { id, organisationId }, attributes: ['unitId'], raw: true })) as { unitId: number } | null
  return c?.unitId ?? null
}

/** Loads a case of the organisation and locks its row until the transaction ends (null if absent). */
export async function lockCase(organisationId: number, id: number, transaction: Transaction): Promise<LockedCase | null> {
  const c = (await ServiceCase.findOne({ where: { id, organisationId }, transaction, lock: transaction.LOCK.UPDATE, raw: true })) as ServiceCase | null
  if (!c) return null
  return {
    id: c.id, organisationId: c.organisationId, unitId: c.unitId, status: c.status, lockVersion: c.lockVersion,
    symptoms: c.symptoms as Symptom[], readings: c.readings as CaseReading[], testResults: c.testResults as CaseTestResult[],
    ranking: c.ranking as RankResponse | null,
  }
}

/** Saves changed fields of a locked case and bumps its version. */
export async function saveCase(
  id: number,
  changes: Partial<{ symptoms: Symptom[]; readings: CaseReading[]; testResults: CaseTestResult[]; ranking: RankResponse; notes: string; status: 'closed'; closure: CaseClosure; confirmedCauses: CaseClosure['confirmedCauses']; closedAt: Date }>,
  transaction: Transaction,
) {
  // A plain UPDATE: the JSON columns are sent as JSON text, and the version goes up in the same statement.
  const columns: Record<string, string> = {
    symptoms: 'symptoms', readings: 'readings', testResults: 'test_results', ranking: 'ranking', notes: 'notes', status: 'status',
    closure: 'closure', confirmedCauses: 'confirmed_causes', closedAt: 'closed_at',
  }
  const json = new Set(['symptoms', 'readings', 'testResults', 'ranking', 'closure', 'confirmedCauses'])
  const bind: unknown[] = [id]
  const sets = Object.entries(changes).map(([key, value]) => {
    bind.push(json.has(key) ? JSON.stringify(value) : value)
    return `${columns[key]} = $${bind.length}${json.has(key) ? '::jsonb' : ''}`
  })
  await ServiceCase.sequelize!.query(
    `UPDATE cases SET ${[...sets, 'lock_version = lock_version + 1', 'updated_at = now()'].join(', ')} WHERE id = $1`,
    { bind, transaction },
  )
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
}

const iso = (d: Date | null) => (d ? d.toISOString() : null)

type EventRow = Pick<CaseEvent, 'id' | 'at' | 'type' | 'byUserId' | 'payload'>
function eventDto(e: EventRow, names: Map<number, string>): CaseEventDto {
  return { ...e.payload, id: Number(e.id), at: e.at.toISOString(), type: e.type as CaseEventDto['type'], by: e.byUserId ? names.get(e.byUserId) ?? null : null, byUserId: e.byUserId }
}

/** An upload row as the API shows it, with the URLs that serve its file and preview. */
export function uploadDto(u: Upload): UploadDto {
  return {
    id: u.id, mime: u.mime, bytes: u.bytes, originalName: u.originalName, purpose: u.purpose,
    url: `/api/uploads/${u.id}`, thumbUrl: u.thumbKey ? `/api/uploads/${u.id}?thumb=1` : null, createdAt: u.createdAt.toISOString(),
  }
}

/** An e-mail row as the API shows it. */
export function emailDto(e: OutboundEmail): EmailDto {
  return { id: e.id, toAddress: e.toAddress, subject: e.subject, status: e.status, attempts: e.attempts, lastError: e.lastError, sentAt: iso(e.sentAt) }
}

/**
 * The full case record of the organisation, or null. `knownUnit` saves a query when the caller
 * already loaded the case's unit. The timeline grows with every step, so its rows are read raw
 * (no model instances).
 */
export async function findCase(organisationId: number, id: number, knownUnit?: UnitDto): Promise<CaseDto | null> {
  // Read as plain rows (no model instances): this runs after every step a technician takes.
  const c = (await ServiceCase.findOne({ where: { id, organisationId }, raw: true })) as ServiceCase | null
  if (!c) return null
  const [unit, events, transactions, uploads, emails, users] = await Promise.all([
    knownUnit && knownUnit.id === c.unitId ? knownUnit : findUnit(organisationId, c.unitId),
    CaseEvent.findAll({ where: { caseId: id }, order: [['id', 'ASC']], raw: true }) as unknown as Promise<EventRow[]>,
    RefrigerantTransaction.findAll({ where: { caseId: id }, order: [['id', 'ASC']], raw: true }),
    Upload.findAll({ where: { caseId: id, organisationId }, order: [['id', 'ASC']], raw: true }),
    OutboundEmail.findAll({ where: { caseId: id, organisationId }, order: [['id', 'ASC']], raw: true }),
    User.findAll({ where: { organisationId }, attributes: ['id', 'name'], raw: true }),
  ])
  if (!unit) return null
  const names = new Map(users.map((u) => [u.id, u.name]))
  return {
    id: c.id,
    unitId: c.unitId,
    status: c.status,
    complaint: c.complaint,
    symptoms: c.symptoms as Symptom[],
    readings: c.readings as CaseReading[],
    testResults: c.testResults as CaseTestResult[],
    ranking: c.ranking as RankResponse | null,
    events: events.map((e) => eventDto(e, names)),
    version: c.lockVersion,
    technician: c.technicianId ? names.get(c.technicianId) ?? null : null,
    openedAt: c.openedAt.toISOString(),
    closedAt: iso(c.closedAt),
    notes: c.notes,
    closure: c.closure as CaseClosure | null,
    unit,
    transactions: transactions.map((t) => ({ id: t.id, stage: t.stage as RefrigerantTransactionDto['stage'], refrigerant: t.refrigerant, grams: t.grams, direction: t.direction, cylinder: t.cylinder, at: t.at.toISOString() })),
    uploads: uploads.map(uploadDto),
    emails: emails.map(emailDto),
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

/** One page of the organisation's cases, open ones first, with full-text search over complaint and notes. */
export async function listCases(organisationId: number, f: CaseFilters): Promise<{ items: CaseListItem[]; total: number }> {
  const where: WhereOptions[] = [{ organisationId }]
  if (f.status) where.push({ status: f.status })
  if (f.unitId) where.push({ unitId: f.unitId })
  if (f.technicianId) where.push({ technicianId: f.technicianId })
  if (f.from) where.push({ openedAt: { [Op.gte]: f.from } })
  if (f.to) where.push({ openedAt: { [Op.lte]: f.to } })
  if (f.cause) where.push(ServiceCase.sequelize!.literal(`confirmed_causes @> ${ServiceCase.sequelize!.escape(JSON.stringify([{ cause: f.cause }]))}::jsonb`))
  if (f.q) where.push(ServiceCase.sequelize!.literal(`search @@ websearch_to_tsquery('english', ${ServiceCase.sequelize!.escape(f.q)})`))
  const siteWhere = f.customerId ? { customerId: f.customerId } : undefined
  const order: [unknown, string][] = [[ServiceCase.sequelize!.literal(`CASE WHEN "ServiceCase"."status" = 'open' THEN 0 ELSE 1 END`), 'ASC']]
  if (f.sort === 'unit') order.push([{ model: Unit, as: 'unit' }, 'name', f.direction.toUpperCase()] as unknown as [unknown, string])
  else if (f.sort === 'status') order.push(['status', f.direction.toUpperCase()])
  order.push(['openedAt', f.sort === 'opened' ? f.direction.toUpperCase() : 'DESC'])
  const { rows, count } = await ServiceCase.findAndCountAll({
    where: { [Op.and]: where },
    include: [
      { model: Unit, as: 'unit', required: true, include: [{ model: Site, as: 'site', required: true, where: siteWhere, include: [{ model: Customer, as: 'customer' }] }] },
      { model: User, as: 'technician' },
    ],
    order: order as never,
    limit: f.pageSize,
    offset: (f.page - 1) * f.pageSize,
    distinct: true,
  })
  type Row = ServiceCase & { unit: Unit & { site: Site & { customer: Customer } }; technician: User | null }
  return {
    total: count,
    items: (rows as Row[]).map((c) => {
      const top = (c.ranking as RankResponse | null)?.causes[0]
      return {
        id: c.id, status: c.status, complaint: c.complaint, unitId: c.unitId, unitName: c.unit.name, customer: c.unit.site.customer.name,
        technician: c.technician?.name ?? null, openedAt: c.openedAt.toISOString(), closedAt: iso(c.closedAt),
        confirmedCauses: c.confirmedCauses, topCause: top ? { cause: top.cause, stage: top.stage, probability: top.probability } : null,
      }
    }),
  }
}

/** How often each cause was confirmed on the organisation's closed cases of units of one class (or kind). */
export async function confirmedCauseCounts(organisationId: number, group: { equipmentClass: string } | { kind: string }) {
  const [column, value] = 'equipmentClass' in group ? ['equipment_class', group.equipmentClass] : ['kind', group.kind]
  return ServiceCase.sequelize!.query<{ cause: string; stage: string | null; count: number }>(
    `SELECT elem->>'cause' AS cause, elem->>'stage' AS stage, count(*)::int AS count
       FROM cases c JOIN units u ON u.id = c.unit_id, jsonb_array_elements(c.confirmed_causes) elem
      WHERE c.organisation_id = :organisationId AND c.status = 'closed' AND u.${column} = :value
      GROUP BY 1, 2`,
    { replacements: { organisationId, value }, type: QueryTypes.SELECT },
  )
}

/** Refrigerant log of a unit, newest first. */
export async function unitTransactions(organisationId: number, unitId: number): Promise<RefrigerantTransactionDto[]> {
  const rows = await RefrigerantTransaction.findAll({ where: { organisationId, unitId }, order: [['at', 'DESC']] })
  return rows.map((t) => ({ id: t.id, stage: t.stage as RefrigerantTransactionDto['stage'], refrigerant: t.refrigerant, grams: t.grams, direction: t.direction, cylinder: t.cylinder, at: t.at.toISOString() }))
}

/** Confirmed causes and the top of the last ranking of the organisation's latest closed cases. */
export async function closedCaseRankings(organisationId: number, limit = 500) {
  const rows = await ServiceCase.sequelize!.query<{ confirmed: { cause: string; stage?: string }[]; ranked: { cause: string; stage?: string }[] | null }>(
    `SELECT confirmed_causes AS confirmed, jsonb_path_query_array(ranking, '$.causes[0 to 2]') AS ranked
       FROM cases WHERE organisation_id = :organisationId AND status = 'closed' AND ranking IS NOT NULL
      ORDER BY closed_at DESC LIMIT :limit`,
    { replacements: { organisationId, limit }, type: QueryTypes.SELECT },
  )
  return rows.map((r) => ({ confirmed: r.confirmed, ranked: r.ranked ?? [] }))
}
