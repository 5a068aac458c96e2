/**
 * Inputs of the knowledge-base authoring routes. A finding, cause or test is checked with the very
 * schema every other source passes (content-src files, bundles, the database), so an editor's field
 * errors name the same paths (`finding.event.params.likelihoods.healthy`).
 */
import { z } from 'zod'
import { causeDefSchema, ruleDefSchema, testDefSchema } from '#server/domain/diagnosis/knowledge-base'
import { findingExamplesSchema } from './examples-schema'

const lockVersion = z.number({ error: 'Send the lock version you edited' }).int().min(0)
const revision = z.number().int().min(0).optional()

/** `POST /api/knowledge-base/versions`: a new draft copied from a version (the published one by default). */
export const newDraftSchema = z.object({ from: z.number().int().positive().optional(), label: z.string().trim().min(1).max(120).optional() }).strict()

/** `PUT …/findings/{name}`. */
export const findingEditSchema = z.object({ lockVersion, revision, finding: ruleDefSchema, examples: findingExamplesSchema.default([]) }).strict()
export type FindingEdit = z.infer<typeof findingEditSchema>

/** `POST …/findings`. */
export const findingCreateSchema = z.object({ revision, finding: ruleDefSchema, examples: findingExamplesSchema.default([]) }).strict()
export type FindingCreate = z.infer<typeof findingCreateSchema>

/** `PUT …/causes/{slug}`. */
export const causeEditSchema = z.object({ lockVersion, revision, cause: causeDefSchema }).strict()
export type CauseEdit = z.infer<typeof causeEditSchema>

/** `PUT …/tests/{slug}`. */
export const testEditSchema = z.object({ lockVersion, revision, test: testDefSchema }).strict()
export type TestEdit = z.infer<typeof testEditSchema>

/** `POST …/submit`. */
export const submitSchema = z.object({ revision }).strict()

/** `POST …/review`: a return needs comments saying what to change. */
export const reviewSchema = z
  .object({ decision: z.enum(['approve', 'return'], { error: 'decision must be "approve" or "return"' }), comment: z.string().trim().max(4000).default('') })
  .strict()
  .refine((r) => r.decision === 'approve' || r.comment.length > 0, { path: ['comment'], message: 'Say what should change before returning the draft' })
export type ReviewInput = z.infer<typeof reviewSchema>

/** Route parameters naming an item of a version. */
export const itemParamsSchema = z.object({
  id: z.coerce.number({ error: 'Id must be a positive integer' }).int().positive('Id must be a positive integer'),
  key: z.string().trim().min(1).max(120),
})

/** `GET /api/knowledge-base/audit`. */
export const auditQuerySchema = z.object({
  versionId: z.coerce.number().int().positive().optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})

/** `DELETE …/findings/{name}?lockVersion=`. */
export const deleteQuerySchema = z.object({ lockVersion: z.coerce.number().int().min(0) })
