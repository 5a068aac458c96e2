import { z } from 'zod'
import { rowId } from './common'
import { causeSchema, quantitySchema, stageSchema, testSlugSchema } from './diagnosis'

const title = z.string({ error: 'Give the exercise a title' }).trim().min(3, 'Give the exercise a title of a few words').max(200, 'Keep the title under 200 characters')
const quantity = quantitySchema

/** What the trainee sees at the start: the complaint, the symptoms and chosen recorded readings. */
export const ExerciseStartSchema = z
  .object({
    complaint: z.boolean().default(true),
    symptoms: z.boolean().default(true),
    readings: z.array(z.object({ quantity, stage: stageSchema.optional() }).strict()).max(40).default([]),
  })
  .strict()

/** `POST /api/exercises`: an exercise from a closed case; the start and assignees may follow later. */
export const NewExerciseSchema = z
  .object({
    caseId: rowId('Pick a closed case'),
    title,
    start: ExerciseStartSchema.optional(),
    assignees: z.array(rowId('Pick people by their number')).max(200).optional(),
  })
  .strict()
export type NewExerciseInput = z.infer<typeof NewExerciseSchema>

/** `PATCH /api/exercises/{id}`: a new title or start. */
export const UpdateExerciseSchema = z.object({ title: title.optional(), start: ExerciseStartSchema.optional() }).strict()
export type UpdateExerciseInput = z.infer<typeof UpdateExerciseSchema>

/** `PUT /api/exercises/{id}/assignees`: everyone the exercise is assigned to. */
export const AssigneesSchema = z.object({ userIds: z.array(rowId('Pick people by their number')).max(200) }).strict()

/** `POST /api/exercise-attempts/{id}/requests`: ask for a reading or a test. */
export const AttemptRequestSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('reading'), quantity, stage: stageSchema.optional() }).strict(),
  z.object({ kind: z.literal('test'), test: testSlugSchema, stage: stageSchema.optional() }).strict(),
], { error: 'Ask for a reading or a test' })
export type AttemptRequestInput = z.infer<typeof AttemptRequestSchema>

/** `POST /api/exercise-attempts/{id}/answer`: the cause named for each stage. */
export const AttemptAnswerSchema = z
  .object({ causes: z.array(z.object({ stage: stageSchema, cause: causeSchema }).strict()).min(1, 'Name a cause for each stage').max(3) })
  .strict()
export type AttemptAnswerInput = z.infer<typeof AttemptAnswerSchema>
