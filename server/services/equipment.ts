// The equipment register's use cases: units with their stages, customers, sites and contacts, and
// the unit page's overview. Every read and write is scoped to the actor's organisation; a record of
// another organisation answers exactly like a missing one.
import { findCases, unitTransactions } from '#server/db/repositories/case-records'
import {
  findCustomer, findCustomers, findSite, findSites, insertContact, insertCustomer, insertSite, removeContact, saveContact, saveCustomer, saveSite,
} from '#server/db/repositories/customers'
import { findUnit, findUnitPage, findUnits, insertUnit, saveUnit } from '#server/db/repositories/equipment'
import { insertRefill, nameplateHistory } from '#server/db/repositories/nameplate'
import { readCaseState } from '#server/db/repositories/case-records'
import { appendEvents } from '#server/db/repositories/case-writes'
import { planRefill } from '#server/domain/equipment/nameplate'
import { unitUploads } from '#server/db/repositories/uploads'
import { mergeUnitPatch } from '#server/domain/equipment/unit-patch'
import { refrigerantSafety } from '#server/domain/equipment/refrigerant-safety'
import { ConflictError, FieldNotFoundError, ForbiddenError, NotFoundError } from '#server/domain/errors'
import { can } from '#shared/utils/permissions'
import {
  UnitInputSchema, type ContactInput, type ContactPatch, type CustomerInput, type CustomerListQuery, type CustomerPatch, type SiteInput, type SitePatch,
  type NameplateRefillInput, type UnitInput, type UnitPatch, type UnitRegisterQuery,
} from '#shared/schemas/equipment'
import type { ContactDto, CustomerDto, NameplateRecordDto, Page, SiteDto, UnitDto } from '#shared/types/equipment-dto'
import type { UnitOverviewDto } from '#shared/types/unit-overview'
import type { UploadDto } from '#shared/types/uploads'
import type { Actor } from './types'

const PAST_CASES_SHOWN = 20

function found<T>(value: T | null, what: string): T {
  if (value === null) throw new NotFoundError(`${what} not found`)
  return value
}

/** `GET /api/units`: every unit of the organisation, as a plain list. */
export function listUnits(actor: Actor): Promise<UnitDto[]> {
  return findUnits(actor.organisationId)
}

/** `GET /api/equipment/units`: one page of the register, searched and sorted. */
export async function unitRegister(actor: Actor, query: UnitRegisterQuery): Promise<Page<UnitDto>> {
  const { items, total } = await findUnitPage(actor.organisationId, query)
  return { items, total, page: query.page, pageSize: query.pageSize }
}

/** `GET /api/units/{id}`: one unit, or 404. */
export async function getUnit(actor: Actor, input: { unitId: number }): Promise<UnitDto> {
  return found(await findUnit(actor.organisationId, input.unitId), 'Unit')
}

/** `POST /api/units`: adds a unit with its stages (409 on a serial already registered). */
export async function createUnit(actor: Actor, input: UnitInput): Promise<UnitDto> {
  const id = await insertUnit(actor.organisationId, input)
  return getUnit(actor, { unitId: id })
}

/** `PATCH /api/units/{id}`: the merged unit must pass the same checks as a new one. */
export async function updateUnit(actor: Actor, input: { unitId: number; patch: UnitPatch }): Promise<UnitDto> {
  const saved = await getUnit(actor, input)
  await saveUnit(actor.organisationId, input.unitId, parseAs(UnitInputSchema, mergeUnitPatch(saved, input.patch)))
  return getUnit(actor, input)
}

/** `GET /api/units/{id}/overview`: the unit with its refrigerant cautions, cases, refrigerant log and files. */
export async function unitOverview(actor: Actor, input: { unitId: number }): Promise<UnitOverviewDto> {
  const unit = await getUnit(actor, input)
  const base = { unitId: unit.id, sort: 'opened', direction: 'desc', page: 1 } as const
  const [open, past, transactions, uploads] = await Promise.all([
    findCases(actor.organisationId, { ...base, status: 'open', pageSize: 100 }),
    findCases(actor.organisationId, { ...base, status: 'closed', pageSize: PAST_CASES_SHOWN }),
    unitTransactions(actor.organisationId, unit.id),
    unitUploads(actor.organisationId, unit.id),
  ])
  return {
    unit, refrigerants: refrigerantSafety(unit.stages.map((s) => s.refrigerant)), openCases: open.items, pastCases: past.items, pastCaseTotal: past.total,
    transactions, uploads, nameplate: uploads.find((u) => u.purpose === 'nameplate') ?? null,
  }
}

/** `GET /api/units/{id}/nameplate`: the unit's nameplate history, newest first. */
export async function unitNameplateHistory(actor: Actor, input: { unitId: number }): Promise<NameplateRecordDto[]> {
  await getUnit(actor, input)
  return nameplateHistory(actor.organisationId, input.unitId)
}

/**
 * `POST /api/units/{id}/nameplate`: a stage refilled with another refrigerant (or another charge).
 * The stage takes the new fill and a nameplate record keeps what it held before, when, by whom and
 * on which basis; when the refill happened in an open case of this unit, its timeline records it.
 */
export async function refillStage(actor: Actor, input: NameplateRefillInput & { unitId: number }, now: Date): Promise<{ unit: UnitDto; history: NameplateRecordDto[]; warnings: string[] }> {
  const unit = await getUnit(actor, input)
  const plan = planRefill(unit, input)
  // Recording the refill in a case writes to the case too: the role must also be one that works cases.
  if (input.caseId !== undefined && !can(actor.role, 'cases:work')) throw new ForbiddenError('Your role may not add to a case')
  await useDb().transaction(async (transaction) => {
    if (input.caseId !== undefined) {
      const c = await readCaseState(actor.organisationId, input.caseId, transaction)
      if (!c || c.unitId !== unit.id) throw new FieldNotFoundError('No case of this unit has that number', 'caseId')
      if (c.status === 'closed') throw new ConflictError('That case is closed; record the refill on the unit alone, or in an open case.')
    }
    await insertRefill({
      organisationId: actor.organisationId, unitId: unit.id, stage: plan.stage, refrigerant: plan.refrigerant, chargeG: plan.chargeG,
      previousRefrigerant: plan.previousRefrigerant, previousChargeG: plan.previousChargeG, basis: plan.basis, note: plan.note,
      standingPressureKpa: plan.given?.standingPressureKpa ?? null, ambientC: plan.given?.ambientC ?? null,
      referenceStandingPressureKpa: plan.reference?.standingPressureKpa ?? null, referenceAmbientC: plan.reference?.ambientC ?? null,
      caseId: input.caseId ?? null, byUserId: actor.id, at: now,
    }, transaction)
    if (input.caseId !== undefined) {
      await appendEvents(input.caseId, actor.id, [{
        type: 'nameplate-changed',
        payload: {
          stage: plan.stage, refrigerant: plan.refrigerant, chargeG: plan.chargeG, previousRefrigerant: plan.previousRefrigerant, previousChargeG: plan.previousChargeG,
          basis: plan.basis, note: plan.note, ...(plan.given ? { standingPressureKpa: plan.given.standingPressureKpa, ambientC: plan.given.ambientC } : {}), warnings: plan.warnings,
        },
      }], transaction, now)
    }
  })
  const [saved, history] = await Promise.all([getUnit(actor, input), nameplateHistory(actor.organisationId, unit.id)])
  return { unit: saved, history, warnings: plan.warnings }
}

/** `GET /api/units/{id}/uploads`: files filed against the unit itself, newest first. */
export async function unitFiles(actor: Actor, input: { unitId: number }): Promise<UploadDto[]> {
  await getUnit(actor, input)
  return unitUploads(actor.organisationId, input.unitId)
}

/** `GET /api/customers`: one page of customers with their sites and contacts. */
export async function listCustomers(actor: Actor, query: CustomerListQuery): Promise<Page<CustomerDto>> {
  const { items, total } = await findCustomers(actor.organisationId, query)
  return { items, total, page: query.page, pageSize: query.pageSize }
}

/** `GET /api/customers/{id}`: one customer, or 404. */
export async function getCustomer(actor: Actor, input: { customerId: number }): Promise<CustomerDto> {
  return found(await findCustomer(actor.organisationId, input.customerId), 'Customer')
}

/** `POST /api/customers`: adds a customer (409 on a name already used). */
export async function createCustomer(actor: Actor, input: CustomerInput): Promise<CustomerDto> {
  return getCustomer(actor, { customerId: await insertCustomer(actor.organisationId, input) })
}

/** `PATCH /api/customers/{id}`. */
export async function updateCustomer(actor: Actor, input: { customerId: number; patch: CustomerPatch }): Promise<CustomerDto> {
  await saveCustomer(actor.organisationId, input.customerId, input.patch)
  return getCustomer(actor, input)
}

/** `GET /api/sites`: the organisation's sites, of one customer when given. */
export function listSites(actor: Actor, input: { customerId?: number }): Promise<SiteDto[]> {
  return findSites(actor.organisationId, input.customerId)
}

/** `GET /api/sites/{id}`: one site, or 404. */
export async function getSite(actor: Actor, input: { siteId: number }): Promise<SiteDto> {
  return found(await findSite(actor.organisationId, input.siteId), 'Site')
}

/** `POST /api/sites`: adds a site to a customer of the organisation. */
export async function createSite(actor: Actor, input: SiteInput): Promise<SiteDto> {
  return getSite(actor, { siteId: await insertSite(actor.organisationId, input) })
}

/** `PATCH /api/sites/{id}`. */
export async function updateSite(actor: Actor, input: { siteId: number; patch: SitePatch }): Promise<SiteDto> {
  await saveSite(actor.organisationId, input.siteId, input.patch)
  return getSite(actor, input)
}

/** `POST /api/sites/{id}/contacts`: adds a contact at a site. */
export function createContact(actor: Actor, input: { siteId: number; contact: ContactInput }): Promise<ContactDto> {
  return insertContact(actor.organisationId, input.siteId, input.contact)
}

/** `PATCH /api/contacts/{id}`. */
export function updateContact(actor: Actor, input: { contactId: number; patch: ContactPatch }): Promise<ContactDto> {
  return saveContact(actor.organisationId, input.contactId, input.patch)
}

/** `DELETE /api/contacts/{id}`. */
export function deleteContact(actor: Actor, input: { contactId: number }): Promise<void> {
  return removeContact(actor.organisationId, input.contactId)
}
