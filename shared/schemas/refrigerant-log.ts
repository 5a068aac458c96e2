/**
 * Inputs of the refrigerant log: a line added by hand, a leak check or repair, a unit's compliance
 * settings, the organisation's jurisdiction, a cylinder record. The log page's forms check the same
 * fields with these schemas.
 */
import { z } from 'zod'
import { rowId } from './common'
import { APPLIANCE_TYPES, LEAK_RATE_METHODS } from '#shared/types/compliance'
import { ADDITION_PURPOSES, CHECK_KINDS, CYLINDER_PURPOSES } from '#shared/types/refrigerant-log'
import { STAGES } from '#shared/types/diagnosis'

const enumOf = <const T extends readonly [string, ...string[]]>(label: string, words: T) =>
  z.enum(words, {
    error: (issue) => (issue.input === undefined ? `Give the ${label}: ${words.join(', ')}` : `Unknown ${label} ${JSON.stringify(issue.input)}; allowed: ${words.join(', ')}`),
  })
const when = z.iso.datetime({ offset: true, error: 'Give the date and time as ISO 8601, e.g. 2026-03-01T09:30:00Z' }).or(z.iso.date({ error: 'Give the date as YYYY-MM-DD' }))
const cylinderLabel = z.string({ error: 'The cylinder is its label, e.g. RC-07' }).trim().max(80, 'A cylinder label has at most 80 characters')
const caseId = rowId('The case is its number')

/** `POST /api/units/{id}/refrigerant-log`: refrigerant added to or recovered from one stage. */
export const LogLineSchema = z
  .object({
    stage: enumOf('stage', STAGES),
    refrigerant: z.string({ error: 'Give the refrigerant, e.g. R404A' }).trim().min(2, 'Give the refrigerant, e.g. R404A').max(12),
    grams: z.number({ error: 'Grams must be a number' }).finite().positive('Grams must be more than 0').max(500_000, 'That is more than any unit holds'),
    direction: enumOf('direction', ['added', 'recovered'] as const),
    cylinder: cylinderLabel.default(''),
    at: when.optional(),
    caseId: caseId.optional(),
    purpose: enumOf('reason for the addition', ADDITION_PURPOSES).optional(),
    note: z.string().trim().max(500).default(''),
  })
  .strict()
  .superRefine((line, ctx) => {
    if (line.direction === 'recovered' && !line.cylinder) ctx.addIssue({ code: 'custom', path: ['cylinder'], message: 'Name the cylinder the refrigerant was recovered into' })
    if (line.direction === 'recovered' && line.purpose) ctx.addIssue({ code: 'custom', path: ['purpose'], message: 'A reason is given for additions only' })
  })
export type LogLineInput = z.infer<typeof LogLineSchema>

/** `POST /api/units/{id}/compliance-checks`: a leak check, repair, verification test or report. */
export const ComplianceCheckSchema = z
  .object({
    kind: enumOf('kind of check', CHECK_KINDS),
    stage: enumOf('stage', STAGES).optional(),
    passed: z.boolean({ error: 'Say whether it passed (true or false)' }),
    at: when.optional(),
    caseId: caseId.optional(),
    note: z.string().trim().max(500).default(''),
  })
  .strict()
export type ComplianceCheckInput = z.infer<typeof ComplianceCheckSchema>

/** `PUT /api/units/{id}/compliance-settings`. */
export const UnitComplianceSettingsSchema = z
  .object({
    applianceType: enumOf('appliance type', APPLIANCE_TYPES),
    hermeticallySealed: z.boolean({ error: 'hermeticallySealed must be true or false' }).default(false),
    leakDetectionSystem: z.boolean({ error: 'leakDetectionSystem must be true or false' }).default(false),
  })
  .strict()
export type UnitComplianceSettingsInput = z.infer<typeof UnitComplianceSettingsSchema>

/** `PUT /api/compliance/settings`: the organisation's jurisdiction and leak-rate method. */
export const ComplianceSettingsSchema = z
  .object({
    jurisdiction: z.string({ error: 'Give a jurisdiction, e.g. us-federal' }).trim().regex(/^[a-z0-9-]{1,40}$/, 'A jurisdiction is a short id such as us-federal'),
    leakRateMethod: enumOf('leak-rate method', LEAK_RATE_METHODS).default('annualizing'),
  })
  .strict()
export type ComplianceSettingsInput = z.infer<typeof ComplianceSettingsSchema>

/** `POST /api/cylinders`. */
export const CylinderSchema = z
  .object({
    label: cylinderLabel.min(1, 'Give the cylinder its label, e.g. RC-07'),
    refrigerant: z.string().trim().min(2).max(12).optional(),
    purpose: enumOf('cylinder use', CYLINDER_PURPOSES).default('recovery'),
    note: z.string().trim().max(300).default(''),
  })
  .strict()
export type CylinderInput = z.infer<typeof CylinderSchema>

/** `GET /api/compliance/due` query. */
export const DueQuerySchema = z.object({
  horizonDays: z.coerce.number({ error: 'horizonDays must be a number of days' }).int().min(0).max(3650).default(30),
})
