import { z } from 'zod'
import { ruleDefSchema } from '#server/domain/diagnosis/knowledge-base'
import { findingExamplesSchema } from '#server/domain/knowledge/examples-schema'

const BodySchema = z.object({ finding: ruleDefSchema, examples: findingExamplesSchema.optional() })

// Checks a finding (and its examples) as an editor holds it with the schemas every stored finding passes; 400 with field errors.
export default defineApiHandler(async (event) => {
  await requireUser(event, 'knowledge:author')
  await readBodyAs(event, BodySchema)
  return { valid: true }
})
