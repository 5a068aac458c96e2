import { z } from 'zod'
import { rowId } from './common'
import { causeSchema, readingSchema, readingUnitSchema, stageSchema, symptomSchema, testSlugSchema, wordEnum } from './diagnosis'
import { safeText } from './safe-text'
import { CASE_STATUSES, CONFIRMATION_BASES } from '#shared/types/cases'

const version = z.number().int().nonnegative().optional()
const text = (max: number) => safeText(max)

/** `POST /api/cases`: open a case on a unit. */
export const NewCaseSchema = z
  .object({
    unitId: rowId('Pick a unit'),
    complaint: text(2000).min(3, 'Describe the complaint in a few words'),
    symptoms: z.array(symptomSchema).max(20).default([]),
  })
  .strict()
export type NewCaseInput = z.infer<typeof NewCaseSchema>

const reason = text(500).min(3, 'Give the reason in a few words')

/**
 * `POST /api/cases/{id}/readings`. `version` (optional) guards against overwriting newer changes;
 * `confirmations` keep readings far outside the unit's design envelope, each with the reason.
 */
export const AddReadingsSchema = z
  .object({
    readings: z.array(readingSchema).min(1, 'Enter at least one reading').max(100),
    confirmations: z.array(z.object({ index: z.number().int().nonnegative(), reason }).strict()).max(100).default([]),
    version,
  })
  .strict()
export type AddReadingsInput = z.infer<typeof AddReadingsSchema>

/** `POST /api/cases/{id}/test-results`. */
export const AddTestResultSchema = z
  .object({ test: testSlugSchema, stage: stageSchema.optional(), outcome: z.string().trim().min(1).max(60), note: text(2000).optional(), version })
  .strict()
export type AddTestResultInput = z.infer<typeof AddTestResultSchema>

/** `POST /api/cases/{id}/readings/{index}/correction`: strike a reading out, or correct its figure, with a reason. */
export const ReadingCorrectionSchema = z
  .object({
    action: z.enum(['strike', 'correct'], { error: 'action must be "strike" or "correct"' }),
    reason,
    value: z.union([z.number().finite(), z.boolean()]).optional(),
    unit: readingUnitSchema.optional(),
    /** Keeps a corrected figure that is far outside the unit's design envelope. */
    confirmReason: reason.optional(),
    version,
  })
  .strict()
  .superRefine((c, ctx) => {
    if (c.action === 'correct' && c.value === undefined) ctx.addIssue({ code: 'custom', path: ['value'], message: 'Enter the corrected value' })
  })
export type ReadingCorrectionInput = z.infer<typeof ReadingCorrectionSchema>

/** `POST /api/cases/{id}/outcomes/{index}/correction`: strike a test outcome out, or correct it, with a reason. */
export const OutcomeCorrectionSchema = z
  .object({
    action: z.enum(['strike', 'correct'], { error: 'action must be "strike" or "correct"' }),
    reason,
    outcome: z.string().trim().min(1).max(60).optional(),
    version,
  })
  .strict()
  .superRefine((c, ctx) => {
    if (c.action === 'correct' && !c.outcome) ctx.addIssue({ code: 'custom', path: ['outcome'], message: 'Pick the corrected outcome' })
  })
export type OutcomeCorrectionInput = z.infer<typeof OutcomeCorrectionSchema>

/** `POST /api/cases/{id}/steps/{index}/strike`: a step recorded by mistake, struck out with a reason. */
export const StrikeSchema = z.object({ reason, version }).strict()
export type StrikeInput = z.infer<typeof StrikeSchema>

/** A route with a case id and the position of an entry in one of its lists. */
export const CaseEntryParamsSchema = z.object({
  id: z.coerce.number({ error: 'Id must be a positive integer' }).int('Id must be a positive integer').positive('Id must be a positive integer'),
  index: z.coerce.number({ error: 'The entry must be a whole number from 0' }).int('The entry must be a whole number from 0').nonnegative('The entry must be a whole number from 0'),
})

/** `PUT /api/cases/{id}/symptoms`: the full set of symptoms now ticked. */
export const SetSymptomsSchema = z.object({ symptoms: z.array(symptomSchema).max(20), version }).strict()
export type SetSymptomsInput = z.infer<typeof SetSymptomsSchema>

/** `POST /api/cases/{id}/notes` and `/addendum`. */
export const NoteSchema = z.object({ text: text(4000).min(1, 'Write the note first'), version }).strict()
export type NoteInput = z.infer<typeof NoteSchema>

export const RefrigerantTransactionSchema = z
  .object({
    stage: stageSchema,
    refrigerant: z.string().trim().min(2).max(12),
    grams: z.number({ error: 'Grams must be a number' }).positive('Grams must be more than 0').max(500_000, 'That is more than any unit holds'),
    direction: z.enum(['added', 'recovered'], { error: 'direction must be "added" or "recovered"' }),
    cylinder: text(80).default(''),
  })
  .strict()

/** `POST /api/cases/{id}/close`. */
export const CloseCaseSchema = z
  .object({
    confirmedCauses: z
      .array(z.object({ cause: causeSchema, stage: stageSchema.optional(), basis: wordEnum('confirmation basis', CONFIRMATION_BASES).optional() }).strict())
      .min(1, 'Confirm at least one cause (or "other")').max(20),
    workDone: text(4000).min(3, 'Describe the work done'),
    parts: z.array(text(200).min(1)).max(50).default([]),
    refrigerantTransactions: z.array(RefrigerantTransactionSchema).max(20).default([]),
    unitStateAtDeparture: text(500).default(''),
    followUp: text(2000).default(''),
    /** Queue the report to the site's report contacts on closing (default); false to preview and pick recipients first. */
    sendReport: z.boolean().default(true),
    version,
  })
  .strict()
export type CloseCaseInput = z.infer<typeof CloseCaseSchema>

const optionalId = z.coerce.number().int().positive().optional()
/** `GET /api/cases` filters, sorting and paging. */
export const CaseListQuerySchema = z
  .object({
    status: z.enum(CASE_STATUSES).optional(),
    customerId: optionalId,
    unitId: optionalId,
    technicianId: optionalId,
    cause: causeSchema.optional(),
    from: z.coerce.date().optional(),
    to: z.coerce.date().optional(),
    q: z.string().trim().max(200).optional(),
    sort: z.enum(['opened', 'unit', 'status']).default('opened'),
    direction: z.enum(['asc', 'desc']).default('desc'),
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(100).default(20),
  })
  .strict()
export type CaseListQuery = z.infer<typeof CaseListQuerySchema>
