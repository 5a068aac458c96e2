/**
 * Equipment register inputs: customers, sites, contacts and units with their stages.
 * The same schemas check the forms in the browser (app/components/equipment/) and the bodies of
 * the routes under server/api/{customers,sites,contacts,units}, so a message a technician sees
 * beside a field is the message the API would return for it.
 *
 * Optional fields carry no zod defaults on purpose: the PATCH schemas are `.partial()` copies, and a
 * default there would silently overwrite a saved value the request never mentioned.
 */
import { z } from 'zod'
import { rowId } from './common'
import { DESIGNATIONS, findRefrigerant, isDesignation } from '#shared/utils/properties'
import { CUSTOMER_SORTS, EQUIPMENT_CLASSES, SORT_DIRECTIONS, UNIT_SORTS } from '#shared/types/equipment'
import { NAMEPLATE_BASES } from '#shared/types/equipment-dto'
import { UNIT_KINDS, type Stage, type UnitKind } from '#shared/types/diagnosis'
import { STAGES_OF_KIND, meteringDeviceSchema, stageSchema, unitKindSchema, wordEnum } from './diagnosis'

const figure = (n: number) => n.toLocaleString('en-GB').replace(/,/g, ' ')

const text = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, `Keep the ${label.toLowerCase()} under ${max} characters`)
const required = (label: string, max: number) => text(label, max).min(1, `Enter the ${label.toLowerCase()}`)

/** A measured quantity within a plausible range, or null when it is not known. */
const measured = (label: string, unit: string, min: number, max: number) => {
  const range = `${label} must be between ${figure(min)} and ${figure(max)} ${unit}`
  return z.number({ error: `${label} must be a number in ${unit}` }).min(min, range).max(max, range).nullable()
}

const id = (what: string) => z.number({ error: `Pick a ${what}` }).int(`Pick a ${what}`).positive(`Pick a ${what}`)
const nothingToChange = (v: object) => Object.keys(v).length > 0

// ---- customers --------------------------------------------------------------------------------

const customerFields = { name: required('Name', 200), notes: text('Notes', 4000) }

/** `POST /api/customers` and the new-customer form. */
export const CustomerInputSchema = z.object({ ...customerFields, notes: customerFields.notes.optional() }).strict()
export type CustomerInput = z.infer<typeof CustomerInputSchema>

/** `PATCH /api/customers/{id}`: any of the fields. */
export const CustomerPatchSchema = z.object(customerFields).partial().strict().refine(nothingToChange, 'Nothing to change')
export type CustomerPatch = z.infer<typeof CustomerPatchSchema>

const page = z.coerce.number({ error: 'page must be a whole number from 1' }).int('page must be a whole number from 1').min(1, 'page must be a whole number from 1').default(1)
const pageSize = z.coerce.number({ error: 'pageSize must be 1 to 100' }).int('pageSize must be 1 to 100').min(1, 'pageSize must be 1 to 100').max(100, 'pageSize must be 1 to 100').default(20)
const search = z.string().trim().max(200, 'Keep the search under 200 characters').optional()
const direction = wordEnum('direction', SORT_DIRECTIONS).default('asc')
const queryId = z.coerce.number({ error: 'Must be a positive integer id' }).int('Must be a positive integer id').positive('Must be a positive integer id')

/** `GET /api/customers` search, order and page. */
export const CustomerListQuerySchema = z
  .object({ q: search, sort: wordEnum('sort', CUSTOMER_SORTS).default('name'), direction, page, pageSize })
  .strict()
export type CustomerListQuery = z.infer<typeof CustomerListQuerySchema>

// ---- sites and contacts -------------------------------------------------------------------------

// Lowest inhabited ground (about -430 m) to the highest sites a service team is likely to visit;
// the altitude sets the local atmospheric pressure that turns gauge readings into absolute ones.
const altitude = z
  .number({ error: 'Altitude must be a number in metres (0 at sea level)' })
  .min(-430, 'Altitude must be between -430 and 5 000 m')
  .max(5000, 'Altitude must be between -430 and 5 000 m')

const siteFields = { name: required('Site name', 200), address: text('Address', 1000), altitudeM: altitude }

/** `POST /api/sites` and the new-site form. */
export const SiteInputSchema = z
  .object({ customerId: id('customer'), ...siteFields, address: siteFields.address.optional() })
  .strict()
export type SiteInput = z.infer<typeof SiteInputSchema>

/** `PATCH /api/sites/{id}`: name, address or altitude (a site stays with its customer). */
export const SitePatchSchema = z.object(siteFields).partial().strict().refine(nothingToChange, 'Nothing to change')
export type SitePatch = z.infer<typeof SitePatchSchema>

/** `GET /api/sites` filter. */
export const SiteListQuerySchema = z.object({ customerId: queryId.optional() }).strict()

const contactFields = {
  name: required('Name', 120),
  email: z.string({ error: 'Enter a valid e-mail address' }).trim().toLowerCase().max(254).email('Enter a valid e-mail address'),
  phone: text('Phone', 40).regex(/^[0-9+()\-./ ]*$/, 'Use digits, spaces and + ( ) - only'),
  receivesReports: z.boolean({ error: 'receivesReports must be true or false' }),
}

/** `POST /api/sites/{id}/contacts` and the contact form. */
export const ContactInputSchema = z
  .object({ ...contactFields, phone: contactFields.phone.optional(), receivesReports: contactFields.receivesReports.optional() })
  .strict()
export type ContactInput = z.infer<typeof ContactInputSchema>

/** `PATCH /api/contacts/{id}`. */
export const ContactPatchSchema = z.object(contactFields).partial().strict().refine(nothingToChange, 'Nothing to change')
export type ContactPatch = z.infer<typeof ContactPatchSchema>

// ---- units --------------------------------------------------------------------------------------

const refrigerant = z
  .string({ error: 'Pick a refrigerant' })
  .trim()
  .transform((s) => findRefrigerant(s)?.designation ?? s)
  .refine((s) => isDesignation(s), {
    error: (issue) => (issue.input === '' ? 'Pick the refrigerant' : `Unknown refrigerant ${JSON.stringify(issue.input)}; pick one of ${DESIGNATIONS.join(', ')}`),
  })

/** A standing pressure (absolute) and the ambient it stands at: the range a stage's reference may take. */
const standingKpa = (label: string) => measured(label, 'kPa absolute', 1, 15_000)
const standingAmbientC = (label: string) => measured(label, '°C', -40, 60)

/**
 * A standing pressure means nothing without the ambient it was read at, and the reverse: the two
 * fields come together or not at all; the missing one is named.
 */
function pressureWithAmbient<K extends string>(pressureKey: K, ambientKey: K, message: string) {
  return (s: Partial<Record<K, unknown>>, ctx: z.RefinementCtx) => {
    const hasPressure = s[pressureKey] != null
    if (hasPressure !== (s[ambientKey] != null)) ctx.addIssue({ code: 'custom', path: [hasPressure ? ambientKey : pressureKey], message })
  }
}

/** The figures a refill keeps as the stage's new reference standing pressure. */
export const StandingReferenceSchema = z.object({ standingPressureKpa: standingKpa('Standing pressure'), ambientC: standingAmbientC('Ambient') }).strict()

/** One refrigeration circuit of a unit, as entered from the nameplate. */
export const UnitStageInputSchema = z
  .object({
    stage: stageSchema,
    refrigerant,
    chargeG: measured('Charge', 'g', 1, 500_000).optional(),
    // Includes the expansion tank: the standing pressure of a low stage depends on the whole volume.
    volumeL: measured('Volume', 'L', 0.1, 5000).optional(),
    referenceStandingPressureKpa: standingKpa('Reference standing pressure').optional(),
    referenceAmbientC: standingAmbientC('Reference ambient').optional(),
    ratedCurrentA: measured('Rated current', 'A', 0.1, 500).optional(),
    designPressureKpa: measured('Design pressure', 'kPa absolute', 100, 30_000).optional(),
    /** Capillary tube or expansion valve; null or absent when not known. */
    meteringDevice: meteringDeviceSchema.nullable().optional(),
  })
  .strict()
  .superRefine(pressureWithAmbient('referenceStandingPressureKpa', 'referenceAmbientC', 'Give the reference standing pressure and its ambient temperature together, or neither'))
export type UnitStageInput = z.infer<typeof UnitStageInputSchema>

const unitFields = {
  name: required('Name', 200),
  model: required('Model', 120),
  serial: required('Serial number', 120),
  kind: unitKindSchema,
  equipmentClass: wordEnum('equipment class', EQUIPMENT_CLASSES),
  location: text('Location', 200),
  siteId: id('site'),
  designCabinetC: measured('Design cabinet temperature', '°C', -150, 30),
  designCascadeHxC: measured('Design cascade heat exchanger temperature', '°C', -100, 20),
  stages: z.array(UnitStageInputSchema, { error: 'Enter the stages' }).min(1, 'Enter the stages').max(2, 'A unit has at most two stages'),
}

type UnitShape = { kind: UnitKind; stages: { stage: Stage }[]; designCabinetC?: number | null; designCascadeHxC?: number | null }

/** Checks that the stages match the kind and that the design temperatures make sense together. */
function checkUnit(unit: UnitShape, ctx: z.RefinementCtx) {
  const allowed = STAGES_OF_KIND[unit.kind]
  const given = unit.stages.map((s) => s.stage)
  const exact = given.length === allowed.length && allowed.every((s) => given.includes(s))
  if (!exact) {
    const want = unit.kind === 'cascade' ? 'exactly a high stage and a low stage' : 'exactly one stage, "single"'
    ctx.addIssue({ code: 'custom', path: ['stages'], message: `A ${unit.kind} unit has ${want}` })
  }
  if (unit.kind !== 'cascade' && unit.designCascadeHxC != null) {
    ctx.addIssue({ code: 'custom', path: ['designCascadeHxC'], message: 'Only a cascade unit has a cascade heat exchanger' })
  }
  // The low stage condenses in the cascade heat exchanger, so it must run warmer than the cabinet.
  if (unit.kind === 'cascade' && unit.designCabinetC != null && unit.designCascadeHxC != null && unit.designCascadeHxC <= unit.designCabinetC) {
    ctx.addIssue({ code: 'custom', path: ['designCascadeHxC'], message: 'The cascade heat exchanger runs warmer than the cabinet' })
  }
}

/** `POST /api/units` and the unit form: a whole unit with its stages. */
export const UnitInputSchema = z
  .object({
    ...unitFields,
    location: unitFields.location.optional(),
    designCabinetC: unitFields.designCabinetC.optional(),
    designCascadeHxC: unitFields.designCascadeHxC.optional(),
  })
  .strict()
  .superRefine(checkUnit)
export type UnitInput = z.infer<typeof UnitInputSchema>
/** A unit before validation (refrigerant still free text), as a form or a merged patch holds it. */
export type UnitInputDraft = z.input<typeof UnitInputSchema>

/**
 * `PATCH /api/units/{id}`: any of the fields; `stages`, when sent, replaces all stages. The route
 * merges the patch onto the saved unit and checks the result with `UnitInputSchema`.
 */
export const UnitPatchSchema = z.object(unitFields).partial().strict().refine(nothingToChange, 'Nothing to change')
export type UnitPatch = z.infer<typeof UnitPatchSchema>

/** `GET /api/equipment/units`: search, filters, order and page of the register. */
export const UnitRegisterQuerySchema = z
  .object({
    q: search,
    kind: wordEnum('unit kind', UNIT_KINDS).optional(),
    customerId: queryId.optional(),
    sort: wordEnum('sort', UNIT_SORTS).default('name'),
    direction,
    page,
    pageSize,
  })
  .strict()
export type UnitRegisterQuery = z.infer<typeof UnitRegisterQuerySchema>

/** `POST /api/units/{id}/nameplate`: a stage refilled with another refrigerant or charge, kept as a nameplate record. */
export const NameplateRefillSchema = z
  .object({
    stage: stageSchema,
    refrigerant,
    chargeG: measured('Charge', 'g', 1, 500_000).optional(),
    basis: z.enum(NAMEPLATE_BASES, { error: `basis must be one of: ${NAMEPLATE_BASES.join(', ')}` }),
    note: z.string().trim().max(2000, 'Keep it under 2000 characters').optional(),
    /** The case in which the stage was refilled; the case's timeline records it too. */
    caseId: rowId('The case is its number').optional(),
    /**
     * Where the new fill stands (absolute) at a stated ambient, planned or measured: it becomes the
     * stage's reference standing pressure. Without it, a new refrigerant or charge clears the old one.
     */
    standingPressureKpa: StandingReferenceSchema.shape.standingPressureKpa.optional(),
    ambientC: StandingReferenceSchema.shape.ambientC.optional(),
  })
  .strict()
  .superRefine(pressureWithAmbient('standingPressureKpa', 'ambientC', 'Give the standing pressure and the ambient temperature it stands at together, or neither'))
export type NameplateRefillInput = z.infer<typeof NameplateRefillSchema>
