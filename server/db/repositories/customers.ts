// Customers, their sites and the contacts at each site. Every query is scoped to one organisation:
// a record of another organisation is treated exactly like a missing one.
import { Op, UniqueConstraintError, col, fn, literal, where as sqlWhere, type Transaction, type WhereOptions } from 'sequelize'
import { FieldConflictError, FieldNotFoundError, NotFoundError } from '#server/domain/errors'
import type { ContactInput, ContactPatch, CustomerInput, CustomerListQuery, CustomerPatch, SiteInput, SitePatch } from '#shared/schemas/equipment'
import type { ContactDto, CustomerDto, SiteDto } from '#shared/types/equipment-dto'
import { siteAtmosphere } from '#shared/utils/format'
import { Contact, Customer, Site, Unit } from '../models'

/** An ILIKE pattern matching `q` anywhere, with the user's own % and _ taken literally. */
export function containsPattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`
}

function contactDto(c: Contact): ContactDto {
  return { id: c.id, siteId: c.siteId, name: c.name, email: c.email, phone: c.phone, receivesReports: c.receivesReports }
}

function localAtmosphereKpa(altitudeM: number): number | null {
  const atmosphere = siteAtmosphere(altitudeM)
  // Older rows may hold an altitude outside the standard-atmosphere formula; show no figure then.
  return atmosphere.fromAltitude ? Math.round(atmosphere.kpa * 100) / 100 : null
}

type SiteWithParts = Site & { customer: Customer; contacts: Contact[] }

async function unitCountsBySite(siteIds: number[]): Promise<Map<number, number>> {
  if (!siteIds.length) return new Map()
  const rows = (await Unit.findAll({
    attributes: ['siteId', [fn('count', col('id')), 'n']],
    where: { siteId: siteIds },
    group: ['siteId'],
    raw: true,
  })) as unknown as { siteId: number; n: string }[]
  return new Map(rows.map((r) => [r.siteId, Number(r.n)]))
}

async function loadSites(where: WhereOptions<Site>): Promise<SiteDto[]> {
  const sites = (await Site.findAll({
    where,
    include: [{ model: Customer, as: 'customer' }, { model: Contact, as: 'contacts' }],
    order: [['name', 'ASC'], ['id', 'ASC'], [{ model: Contact, as: 'contacts' }, 'name', 'ASC']],
  })) as SiteWithParts[]
  const counts = await unitCountsBySite(sites.map((s) => s.id))
  return sites.map((s) => ({
    id: s.id, customerId: s.customerId, customer: s.customer.name, name: s.name, address: s.address, altitudeM: s.altitudeM,
    atmosphericPressureKpa: localAtmosphereKpa(s.altitudeM), unitCount: counts.get(s.id) ?? 0, contacts: s.contacts.map(contactDto),
  }))
}

async function customerDtos(customers: Customer[]): Promise<CustomerDto[]> {
  const sites = await loadSites({ customerId: customers.map((c) => c.id) })
  return customers.map((c) => {
    const own = sites.filter((s) => s.customerId === c.id)
    return {
      id: c.id, name: c.name, notes: c.notes, createdAt: c.createdAt.toISOString(),
      unitCount: own.reduce((n, s) => n + s.unitCount, 0), sites: own,
    }
  })
}

const NAME_TAKEN = 'A customer with this name is already on the register'

function nameClash(error: unknown): never {
  // The unique index settles two saves racing for the same name.
  if (error instanceof UniqueConstraintError) throw new FieldConflictError(NAME_TAKEN, 'name')
  throw error
}

async function assertNameFree(organisationId: number, name: string, exceptId: number | null) {
  // Case-insensitive: "Orrin Vale" and "orrin vale" would be the same customer twice.
  const clash = await Customer.count({
    where: { [Op.and]: [{ organisationId }, sqlWhere(fn('lower', col('name')), name.toLowerCase()), ...(exceptId ? [{ id: { [Op.ne]: exceptId } }] : [])] },
  })
  if (clash) throw new FieldConflictError(NAME_TAKEN, 'name')
}

/** One page of the organisation's customers, each with its sites and contacts; `q` matches customer or site. */
export async function findCustomers(organisationId: number, f: CustomerListQuery): Promise<{ items: CustomerDto[]; total: number }> {
  const where: WhereOptions[] = [{ organisationId }]
  if (f.q) {
    const p = Customer.sequelize!.escape(containsPattern(f.q))
    where.push({
      [Op.or]: [
        { name: { [Op.iLike]: containsPattern(f.q) } },
        { id: { [Op.in]: literal(`(SELECT customer_id FROM sites WHERE organisation_id = ${Number(organisationId)} AND (name ILIKE ${p} OR address ILIKE ${p}))`) } },
      ],
    })
  }
  const dir = f.direction.toUpperCase()
  const { rows, count } = await Customer.findAndCountAll({
    where: { [Op.and]: where },
    order: [[f.sort, dir], ['id', dir]],
    limit: f.pageSize,
    offset: (f.page - 1) * f.pageSize,
  })
  return { items: await customerDtos(rows), total: count }
}

/** One customer of the organisation with its sites and contacts, or null. */
export async function findCustomer(organisationId: number, id: number): Promise<CustomerDto | null> {
  const customer = await Customer.findOne({ where: { id, organisationId } })
  return customer ? (await customerDtos([customer]))[0]! : null
}

/** Adds a customer; a name already used in the organisation is a conflict. Returns the new id. */
export async function insertCustomer(organisationId: number, input: CustomerInput): Promise<number> {
  await assertNameFree(organisationId, input.name, null)
  try {
    return (await Customer.create({ organisationId, name: input.name, notes: input.notes ?? '' })).id
  } catch (error) {
    return nameClash(error)
  }
}

/** Changes a customer of the organisation (NotFoundError when it is not there). */
export async function saveCustomer(organisationId: number, id: number, patch: CustomerPatch): Promise<void> {
  const customer = await Customer.findOne({ where: { id, organisationId } })
  if (!customer) throw new NotFoundError('Customer not found')
  if (patch.name !== undefined) await assertNameFree(organisationId, patch.name, id)
  await customer.update(patch).catch(nameClash)
}

/** The organisation's sites (of one customer when given), by name, with contacts. */
export function findSites(organisationId: number, customerId?: number): Promise<SiteDto[]> {
  return loadSites(customerId ? { organisationId, customerId } : { organisationId })
}

/** One site of the organisation, or null. */
export async function findSite(organisationId: number, id: number): Promise<SiteDto | null> {
  return (await loadSites({ organisationId, id }))[0] ?? null
}

/** Loads a site of the organisation inside a transaction, or fails on the field that named it. */
export async function requireSite(organisationId: number, id: number, field: string, transaction?: Transaction): Promise<Site> {
  const site = await Site.findOne({ where: { id, organisationId }, transaction })
  if (!site) throw new FieldNotFoundError('Site not found', field)
  return site
}

/** Adds a site to a customer of the organisation. Returns the new id. */
export async function insertSite(organisationId: number, input: SiteInput): Promise<number> {
  const customer = await Customer.findOne({ where: { id: input.customerId, organisationId } })
  if (!customer) throw new FieldNotFoundError('Customer not found', 'customerId')
  const site = await Site.create({ organisationId, customerId: customer.id, name: input.name, address: input.address ?? '', altitudeM: input.altitudeM })
  return site.id
}

/** Changes a site of the organisation. */
export async function saveSite(organisationId: number, id: number, patch: SitePatch): Promise<void> {
  const [changed] = await Site.update(patch, { where: { id, organisationId } })
  if (!changed) throw new NotFoundError('Site not found')
}

/** Adds a contact at a site of the organisation. Returns the contact. */
export async function insertContact(organisationId: number, siteId: number, input: ContactInput): Promise<ContactDto> {
  if (!(await Site.count({ where: { id: siteId, organisationId } }))) throw new NotFoundError('Site not found')
  const contact = await Contact.create({ organisationId, siteId, name: input.name, email: input.email, phone: input.phone ?? '', receivesReports: input.receivesReports ?? true })
  return contactDto(contact)
}

/** Changes a contact of the organisation; returns it. */
export async function saveContact(organisationId: number, id: number, patch: ContactPatch): Promise<ContactDto> {
  const contact = await Contact.findOne({ where: { id, organisationId } })
  if (!contact) throw new NotFoundError('Contact not found')
  await contact.update(patch)
  return contactDto(contact)
}

/** Removes a contact of the organisation. */
export async function removeContact(organisationId: number, id: number): Promise<void> {
  const removed = await Contact.destroy({ where: { id, organisationId } })
  if (!removed) throw new NotFoundError('Contact not found')
}
