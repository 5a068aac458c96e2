// Queries of the refrigerant log: transactions and checks of a unit or an organisation, cylinder
// records, and the compliance settings of the organisation (jurisdiction, method) and of each unit.
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize'
import { FieldConflictError } from '#server/domain/errors'
import type { ApplianceType, LeakRateMethod } from '#shared/types/compliance'
import type { Stage } from '#shared/types/diagnosis'
import type { AdditionPurpose, CheckKind, ComplianceCheckDto, CylinderPurpose, UnitComplianceSettingsDto } from '#shared/types/refrigerant-log'
import { ComplianceCheck, Cylinder, RefrigerantTransaction } from '../models'

const db = () => RefrigerantTransaction.sequelize!

/** A log line as the services hand it to the pure log: with the unit, technician's name and cylinder. */
export interface StoredTransaction {
  id: number
  unitId: number
  caseId: number | null
  at: Date
  stage: Stage
  refrigerant: string
  grams: number
  direction: 'added' | 'recovered'
  cylinder: string
  cylinderId: number | null
  purpose: AdditionPurpose | null
  note: string
  technician: string | null
}

export interface StoredCheck extends ComplianceCheckDto {
  unitId: number
}

/** The organisation's jurisdiction and the leak-rate method it judges by. */
export async function findOrganisationCompliance(organisationId: number): Promise<{ jurisdiction: string; leakRateMethod: LeakRateMethod }> {
  const [row] = await db().query<{ jurisdiction: string; leak_rate_method: LeakRateMethod }>(
    'SELECT jurisdiction, leak_rate_method FROM organisations WHERE id = $1', { bind: [organisationId], type: QueryTypes.SELECT },
  )
  return { jurisdiction: row?.jurisdiction ?? 'us-federal', leakRateMethod: row?.leak_rate_method ?? 'annualizing' }
}

/** Sets the organisation's jurisdiction and leak-rate method. */
export async function saveOrganisationCompliance(organisationId: number, input: { jurisdiction: string; leakRateMethod: LeakRateMethod }) {
  await db().query('UPDATE organisations SET jurisdiction = $2, leak_rate_method = $3, updated_at = now() WHERE id = $1', {
    bind: [organisationId, input.jurisdiction, input.leakRateMethod],
  })
}

interface SettingsRow { id: number; appliance_type: ApplianceType; hermetically_sealed: boolean; leak_detection_system: boolean }
const settingsOf = (r: SettingsRow): UnitComplianceSettingsDto => ({ applianceType: r.appliance_type, hermeticallySealed: r.hermetically_sealed, leakDetectionSystem: r.leak_detection_system })

/** Compliance settings of every unit of the organisation, by unit id. */
export async function findUnitComplianceSettings(organisationId: number, unitId?: number): Promise<Map<number, UnitComplianceSettingsDto>> {
  const rows = await db().query<SettingsRow>(
    `SELECT id, appliance_type, hermetically_sealed, leak_detection_system FROM units WHERE organisation_id = $1 ${unitId ? 'AND id = $2' : ''}`,
    { bind: unitId ? [organisationId, unitId] : [organisationId], type: QueryTypes.SELECT },
  )
  return new Map(rows.map((r) => [r.id, settingsOf(r)]))
}

/** Sets a unit's appliance type and F-gas facts; false when the unit is not the organisation's. */
export async function saveUnitComplianceSettings(organisationId: number, unitId: number, input: UnitComplianceSettingsDto): Promise<boolean> {
  const [, count] = await db().query(
    'UPDATE units SET appliance_type = $3, hermetically_sealed = $4, leak_detection_system = $5, updated_at = now() WHERE id = $2 AND organisation_id = $1',
    { bind: [organisationId, unitId, input.applianceType, input.hermeticallySealed, input.leakDetectionSystem], type: QueryTypes.UPDATE },
  )
  return Number(count) > 0
}

interface TxRow {
  id: number; unit_id: number; case_id: number | null; at: Date; stage: Stage; refrigerant: string; grams: number
  direction: 'added' | 'recovered'; cylinder: string; cylinder_id: number | null; purpose: AdditionPurpose | null; note: string; technician: string | null
}
const txOf = (r: TxRow): StoredTransaction => ({
  id: r.id, unitId: r.unit_id, caseId: r.case_id, at: new Date(r.at), stage: r.stage, refrigerant: r.refrigerant, grams: Number(r.grams),
  direction: r.direction, cylinder: r.cylinder, cylinderId: r.cylinder_id, purpose: r.purpose, note: r.note, technician: r.technician,
})
const TX_SELECT = `SELECT t.id, t.unit_id, t.case_id, t.at, t.stage, t.refrigerant, t.grams, t.direction, COALESCE(c.label, t.cylinder) AS cylinder,
  t.cylinder_id, t.purpose, t.note, u.name AS technician
  FROM refrigerant_transactions t LEFT JOIN users u ON u.id = t.by_user_id LEFT JOIN cylinders c ON c.id = t.cylinder_id`

/** The refrigerant transactions of one unit (or of every unit of the organisation), oldest first. */
export async function findTransactions(organisationId: number, filter: { unitId?: number; cylinderId?: number } = {}): Promise<StoredTransaction[]> {
  const bind: unknown[] = [organisationId]
  let where = 't.organisation_id = $1'
  if (filter.unitId) where += ` AND t.unit_id = $${bind.push(filter.unitId)}`
  if (filter.cylinderId) where += ` AND t.cylinder_id = $${bind.push(filter.cylinderId)}`
  const rows = await db().query<TxRow>(`${TX_SELECT} WHERE ${where} ORDER BY t.at, t.id`, { bind, type: QueryTypes.SELECT })
  return rows.map(txOf)
}

/**
 * Makes a cylinder record for every cylinder label the organisation's transactions name that has
 * none yet, and links those transactions to it. Labels match whatever their letter case.
 */
export async function linkCylinders(organisationId: number, transaction: Transaction): Promise<void> {
  await db().query(
    `INSERT INTO cylinders (organisation_id, label, refrigerant, purpose, created_at, updated_at)
     SELECT DISTINCT ON (upper(trim(cylinder))) organisation_id, trim(cylinder), refrigerant,
            CASE WHEN direction = 'recovered' THEN 'recovery' ELSE 'supply' END, now(), now()
     FROM refrigerant_transactions WHERE organisation_id = $1 AND cylinder_id IS NULL AND trim(cylinder) <> ''
     ORDER BY upper(trim(cylinder)), at
     ON CONFLICT (organisation_id, (upper(label))) DO NOTHING`,
    { bind: [organisationId], transaction },
  )
  await db().query(
    `UPDATE refrigerant_transactions t SET cylinder_id = c.id FROM cylinders c
     WHERE t.organisation_id = $1 AND t.cylinder_id IS NULL AND c.organisation_id = $1 AND upper(c.label) = upper(trim(t.cylinder))`,
    { bind: [organisationId], transaction },
  )
}

/** Records one log line (its cylinder becomes a record when new); returns its id. */
export async function insertLogLine(
  input: { organisationId: number; unitId: number; caseId: number | null; byUserId: number; at: Date; stage: Stage; refrigerant: string; grams: number; direction: 'added' | 'recovered'; cylinder: string; purpose: AdditionPurpose | null; note: string },
  transaction: Transaction,
): Promise<number> {
  const created = await RefrigerantTransaction.create({ ...input, cylinder: input.cylinder.trim() }, { transaction })
  await linkCylinders(input.organisationId, transaction)
  return created.id
}

/** True when the case exists in the organisation and is about this unit. */
export async function caseIsOnUnit(organisationId: number, caseId: number, unitId: number, transaction?: Transaction): Promise<boolean> {
  const rows = await db().query('SELECT 1 FROM cases WHERE id = $1 AND organisation_id = $2 AND unit_id = $3', { bind: [caseId, organisationId, unitId], type: QueryTypes.SELECT, transaction })
  return rows.length > 0
}

interface CheckRow { id: number; unit_id: number; case_id: number | null; stage: Stage | null; kind: CheckKind; passed: boolean; at: Date; note: string; by: string | null }

/** Leak checks, repairs and verification tests of one unit (or every unit), oldest first. */
export async function findChecks(organisationId: number, unitId?: number): Promise<StoredCheck[]> {
  const rows = await db().query<CheckRow>(
    `SELECT k.id, k.unit_id, k.case_id, k.stage, k.kind, k.passed, k.at, k.note, u.name AS by FROM compliance_checks k LEFT JOIN users u ON u.id = k.by_user_id
     WHERE k.organisation_id = $1 ${unitId ? 'AND k.unit_id = $2' : ''} ORDER BY k.at, k.id`,
    { bind: unitId ? [organisationId, unitId] : [organisationId], type: QueryTypes.SELECT },
  )
  return rows.map((r) => ({ id: r.id, unitId: r.unit_id, caseId: r.case_id, stage: r.stage, kind: r.kind, passed: r.passed, at: new Date(r.at).toISOString(), note: r.note, by: r.by }))
}

/** Records a leak check, repair, verification test or report. */
export async function insertCheck(input: { organisationId: number; unitId: number; caseId: number | null; stage: Stage | null; kind: CheckKind; passed: boolean; at: Date; note: string; byUserId: number }, transaction?: Transaction) {
  await ComplianceCheck.create(input, { transaction })
}

export interface CylinderRecord { id: number; label: string; refrigerant: string | null; purpose: CylinderPurpose; note: string }
const cylinderOf = (c: Cylinder): CylinderRecord => ({ id: c.id, label: c.label, refrigerant: c.refrigerant, purpose: c.purpose, note: c.note })

/** Every cylinder record of the organisation, by label. */
export async function findCylinders(organisationId: number): Promise<CylinderRecord[]> {
  return (await Cylinder.findAll({ where: { organisationId }, order: [['label', 'ASC']] })).map(cylinderOf)
}

/** One cylinder of the organisation, or null. */
export async function findCylinder(organisationId: number, id: number): Promise<CylinderRecord | null> {
  const c = await Cylinder.findOne({ where: { organisationId, id } })
  return c ? cylinderOf(c) : null
}

/** True when the organisation already has a cylinder with this label (any letter case). */
export async function cylinderLabelTaken(organisationId: number, label: string): Promise<boolean> {
  const rows = await db().query('SELECT 1 FROM cylinders WHERE organisation_id = $1 AND upper(label) = upper($2)', { bind: [organisationId, label.trim()], type: QueryTypes.SELECT })
  return rows.length > 0
}

/** Records a cylinder; returns its id. */
export async function insertCylinder(organisationId: number, input: { label: string; refrigerant: string | null; purpose: CylinderPurpose; note: string }): Promise<number> {
  try {
    return (await Cylinder.create({ organisationId, ...input })).id
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new FieldConflictError(`A cylinder labelled ${input.label} is already on record`, 'label')
    throw error
  }
}

/** Unit names of the organisation by id, for ledgers that span units. */
export async function findUnitNames(organisationId: number): Promise<Map<number, string>> {
  const rows = await db().query<{ id: number; name: string }>('SELECT id, name FROM units WHERE organisation_id = $1', { bind: [organisationId], type: QueryTypes.SELECT })
  return new Map(rows.map((r) => [r.id, r.name]))
}
