/**
 * Worked examples of a finding: a set of facts and what the finding should then do (apply or not,
 * move a cause up or down). "Check" runs them against a draft (examples.ts); bundles carry them.
 */
import { z } from 'zod'
import { causeSchema, stageSchema } from '#shared/schemas/diagnosis'

const factValueSchema = z.union([z.number().finite(), z.string(), z.boolean()])

export const exampleMoveSchema = z
  .object({ cause: causeSchema, stage: stageSchema.optional(), direction: z.enum(['up', 'down'], { error: 'direction must be "up" or "down"' }) })
  .strict()

export const findingExampleSchema = z
  .object({
    title: z.string().trim().min(1, 'Give the example a title').max(200),
    /** Which copy of a finding written for several stages the example is about; absent for a unit-wide finding. */
    stage: stageSchema.optional(),
    /** The kind of unit the facts describe; by default a cascade for a high or low stage, single-stage for `single`. */
    unitKind: z.enum(['cascade', 'single-stage']).optional(),
    facts: z.record(z.string().min(1), factValueSchema),
    expect: z.enum(['fires', 'does-not-fire'], { error: 'expect must be "fires" or "does-not-fire"' }),
    /** Causes the finding should make more (up) or less (down) likely than the field, when it fires. */
    moves: z.array(exampleMoveSchema).max(20).optional(),
  })
  .strict()
export type FindingExample = z.infer<typeof findingExampleSchema>
export const findingExamplesSchema = z.array(findingExampleSchema).max(50)
