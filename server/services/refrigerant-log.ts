// The refrigerant log's use cases: each unit's log with leak rates, F-gas view and duties; lines and
// checks added by hand; the unit's and the organisation's compliance settings; the list of units
// with duties due; cylinder records and what went into and out of each. Scoped to the actor's
// organisation throughout; a record of another organisation answers like a missing one.
import {
  caseIsOnUnit, cylinderLabelTaken, findChecks, findCylinder, findCylinders, findOrganisationCompliance, findTransactions, findUnitComplianceSettings,
  findUnitNames, insertCheck, insertCylinder, insertLogLine, saveOrganisationCompliance, saveUnitComplianceSettings, type StoredCheck, type StoredTransaction,
} from '#server/db/repositories/refrigerant-log'
import { findUnits } from '#server/db/repositories/equipment'
import { complianceDuties } from '#server/domain/compliance/duties'
import { cylinderLedger, type LogCheck, type LogTransaction } from '#server/domain/compliance/refrigerant-log'
import { JURISDICTIONS, requireJurisdiction } from '#server/domain/compliance/regulation-data'
import { dutyUnit, unitLogView, type LogUnit } from '#server/domain/compliance/unit-log'
import { BadInputError, FieldConflictError, NotFoundError } from '#server/domain/errors'
import type { ComplianceCheckInput, ComplianceSettingsInput, CylinderInput, LogLineInput, UnitComplianceSettingsInput } from '#shared/schemas/refrigerant-log'
import type { UnitDto } from '#shared/types/equipment-dto'
import type {
  ComplianceSettingsDto, CylinderDetailDto, CylinderDto, DueListDto, UnitComplianceSettingsDto, UnitRefrigerantLogDto,
} from '#shared/types/refrigerant-log'
import { getUnit } from './equipment'
import type { Actor } from './types'

const DEFAULT_SETTINGS: UnitComplianceSettingsDto = { applianceType: 'other', hermeticallySealed: false, leakDetectionSystem: false }

const asLine = (t: StoredTransaction): LogTransaction => ({
  id: t.id, at: t.at, stage: t.stage, refrigerant: t.refrigerant, grams: t.grams, direction: t.direction,
  cylinder: t.cylinder, technician: t.technician, caseId: t.caseId, purpose: t.purpose,
})
const asCheck = (c: StoredCheck): LogCheck => ({ at: c.at, stage: c.stage, kind: c.kind, passed: c.passed })
const logUnit = (unit: UnitDto, settings: UnitComplianceSettingsDto | undefined): LogUnit => ({
  id: unit.id, name: unit.name, stages: unit.stages.map((s) => ({ stage: s.stage, refrigerant: s.refrigerant, chargeG: s.chargeG })), settings: settings ?? DEFAULT_SETTINGS,
})
const jurisdictionRef = (id: string) => {
  const j = requireJurisdiction(id)
  return { id: j.id, name: j.name }
}

/** `GET /api/units/{id}/refrigerant-log`: the unit's log per stage with leak rates, F-gas view, checks and duties. */
export async function unitRefrigerantLog(actor: Actor, input: { unitId: number }, now: Date): Promise<UnitRefrigerantLogDto> {
  const unit = await getUnit(actor, input)
  const [org, settings, transactions, checks] = await Promise.all([
    findOrganisationCompliance(actor.organisationId),
    findUnitComplianceSettings(actor.organisationId, unit.id),
    findTransactions(actor.organisationId, { unitId: unit.id }),
    findChecks(actor.organisationId, unit.id),
  ])
  const view = unitLogView(logUnit(unit, settings.get(unit.id)), transactions.map(asLine), checks.map(asCheck), { jurisdiction: org.jurisdiction, method: org.leakRateMethod, today: now })
  return {
    unitId: unit.id, unitName: unit.name, jurisdiction: jurisdictionRef(org.jurisdiction), leakRateMethod: org.leakRateMethod,
    settings: settings.get(unit.id) ?? DEFAULT_SETTINGS, stages: view.stages, fGas: view.fGas, duties: view.duties,
    checks: checks.map(({ unitId: _unit, ...c }) => c),
  }
}

async function assertCaseOnUnit(actor: Actor, caseId: number | undefined, unitId: number): Promise<number | null> {
  if (caseId === undefined) return null
  if (!(await caseIsOnUnit(actor.organisationId, caseId, unitId))) {
    throw new BadInputError('That case is not a case of this unit', { caseId: ['That case is not a case of this unit'] })
  }
  return caseId
}

function when(at: string | undefined, now: Date): Date {
  const date = at ? new Date(/^\d{4}-\d{2}-\d{2}$/.test(at) ? `${at}T12:00:00Z` : at) : now
  if (date.getTime() > now.getTime() + 5 * 60_000) throw new BadInputError('The date cannot be in the future', { at: ['The date cannot be in the future'] })
  return date
}

/** `POST /api/units/{id}/refrigerant-log`: records refrigerant added to or recovered from one stage. */
export async function addLogLine(actor: Actor, input: { unitId: number; line: LogLineInput }, now: Date): Promise<UnitRefrigerantLogDto> {
  const unit = await getUnit(actor, input)
  const { line } = input
  if (!unit.stages.some((s) => s.stage === line.stage)) {
    const message = `This unit has no ${line.stage} stage; its stages: ${unit.stages.map((s) => s.stage).join(', ')}`
    throw new BadInputError(message, { stage: [message] })
  }
  const caseId = await assertCaseOnUnit(actor, line.caseId, unit.id)
  const at = when(line.at, now)
  await useDb().transaction((transaction) =>
    insertLogLine({
      organisationId: actor.organisationId, unitId: unit.id, caseId, byUserId: actor.id, at, stage: line.stage, refrigerant: line.refrigerant,
      grams: line.grams, direction: line.direction, cylinder: line.cylinder, purpose: line.purpose ?? null, note: line.note,
    }, transaction))
  return unitRefrigerantLog(actor, input, now)
}

/** `POST /api/units/{id}/compliance-checks`: records a leak check, repair, verification test or report. */
export async function addComplianceCheck(actor: Actor, input: { unitId: number; check: ComplianceCheckInput }, now: Date): Promise<UnitRefrigerantLogDto> {
  const unit = await getUnit(actor, input)
  const { check } = input
  if (check.stage && !unit.stages.some((s) => s.stage === check.stage)) {
    throw new BadInputError(`This unit has no ${check.stage} stage`, { stage: [`This unit has no ${check.stage} stage`] })
  }
  const caseId = await assertCaseOnUnit(actor, check.caseId, unit.id)
  await insertCheck({
    organisationId: actor.organisationId, unitId: unit.id, caseId, stage: check.stage ?? null, kind: check.kind, passed: check.passed,
    at: when(check.at, now), note: check.note, byUserId: actor.id,
  })
  return unitRefrigerantLog(actor, input, now)
}

/** `PUT /api/units/{id}/compliance-settings`: the unit's appliance type and F-gas facts. */
export async function setUnitComplianceSettings(actor: Actor, input: { unitId: number; settings: UnitComplianceSettingsInput }, now: Date): Promise<UnitRefrigerantLogDto> {
  if (!(await saveUnitComplianceSettings(actor.organisationId, input.unitId, input.settings))) throw new NotFoundError('Unit not found')
  return unitRefrigerantLog(actor, input, now)
}

function settingsDto(org: { jurisdiction: string; leakRateMethod: ComplianceSettingsDto['leakRateMethod'] }): ComplianceSettingsDto {
  return {
    ...org,
    jurisdictions: [...JURISDICTIONS.values()].map((j) => ({ id: j.id, name: j.name, summary: j.summary })),
  }
}

/** `GET /api/compliance/settings`: the organisation's jurisdiction and method, and the jurisdictions on file. */
export async function complianceSettings(actor: Actor): Promise<ComplianceSettingsDto> {
  return settingsDto(await findOrganisationCompliance(actor.organisationId))
}

/** `PUT /api/compliance/settings`: sets them (administrators). */
export async function setComplianceSettings(actor: Actor, input: ComplianceSettingsInput): Promise<ComplianceSettingsDto> {
  if (!JURISDICTIONS.has(input.jurisdiction)) {
    const message = `Unknown jurisdiction "${input.jurisdiction}"; known: ${[...JURISDICTIONS.keys()].join(', ')}`
    throw new BadInputError(message, { jurisdiction: [message] })
  }
  await saveOrganisationCompliance(actor.organisationId, input)
  return complianceSettings(actor)
}

/** `GET /api/compliance/due`: units with leak inspections, checks, repairs or reports due, soonest first. */
export async function dueList(actor: Actor, input: { horizonDays: number }, now: Date): Promise<DueListDto> {
  const [org, units, settings, transactions, checks] = await Promise.all([
    findOrganisationCompliance(actor.organisationId),
    findUnits(actor.organisationId),
    findUnitComplianceSettings(actor.organisationId),
    findTransactions(actor.organisationId),
    findChecks(actor.organisationId),
  ])
  const result = complianceDuties({
    units: units.map((u) => dutyUnit(logUnit(u, settings.get(u.id)))),
    transactions: transactions.map((t) => ({ ...asLine(t), unitId: t.unitId })),
    checks: checks.map((c) => ({ ...asCheck(c), unitId: c.unitId })),
    jurisdiction: org.jurisdiction, today: now, horizonDays: input.horizonDays, method: org.leakRateMethod,
  })
  return { today: result.today, jurisdiction: jurisdictionRef(org.jurisdiction), horizonDays: input.horizonDays, due: result.due, duties: result.duties, logWarnings: result.logWarnings }
}

async function cylinderDtos(actor: Actor, only?: number): Promise<{ list: CylinderDto[]; transactions: StoredTransaction[]; names: Map<number, string> }> {
  const [records, transactions, names] = await Promise.all([
    only ? findCylinder(actor.organisationId, only).then((c) => (c ? [c] : [])) : findCylinders(actor.organisationId),
    findTransactions(actor.organisationId, only ? { cylinderId: only } : {}),
    findUnitNames(actor.organisationId),
  ])
  const list = records.map((c): CylinderDto => {
    const own = transactions.filter((t) => t.cylinderId === c.id)
    const ledger = cylinderLedger(own.map((t) => ({ ...asLine(t), cylinder: c.label, unitId: t.unitId })))[0]
    const recovered = ledger?.recovered ?? []
    const charged = ledger?.charged ?? []
    const sum = (xs: { grams: number }[]) => xs.reduce((s, x) => s + x.grams, 0)
    const unitIds = [...new Set(own.map((t) => t.unitId))]
    return {
      ...c, recovered, charged, netG: Math.round((sum(recovered) - sum(charged)) * 1000) / 1000,
      units: unitIds.map((id) => ({ id, name: names.get(id) ?? `Unit ${id}` })), warnings: ledger?.warnings ?? [],
    }
  })
  return { list, transactions, names }
}

/** `GET /api/cylinders`: every cylinder with what was recovered into it and charged from it. */
export async function listCylinders(actor: Actor): Promise<CylinderDto[]> {
  return (await cylinderDtos(actor)).list
}

/** `GET /api/cylinders/{id}`: one cylinder with every transaction through it, or 404. */
export async function getCylinder(actor: Actor, input: { cylinderId: number }): Promise<CylinderDetailDto> {
  const { list, transactions, names } = await cylinderDtos(actor, input.cylinderId)
  const cylinder = list[0]
  if (!cylinder) throw new NotFoundError('Cylinder not found')
  return {
    ...cylinder,
    transactions: transactions.map((t) => ({
      id: t.id, at: t.at.toISOString(), unitId: t.unitId, unitName: names.get(t.unitId) ?? `Unit ${t.unitId}`, stage: t.stage,
      refrigerant: t.refrigerant, grams: t.grams, direction: t.direction, caseId: t.caseId, technician: t.technician,
    })),
  }
}

/** `POST /api/cylinders`: records a cylinder (409 when its label is taken). */
export async function createCylinder(actor: Actor, input: CylinderInput): Promise<CylinderDetailDto> {
  if (await cylinderLabelTaken(actor.organisationId, input.label)) throw new FieldConflictError(`A cylinder labelled ${input.label} is already on record`, 'label')
  const id = await insertCylinder(actor.organisationId, { label: input.label, refrigerant: input.refrigerant ?? null, purpose: input.purpose, note: input.note })
  return getCylinder(actor, { cylinderId: id })
}
