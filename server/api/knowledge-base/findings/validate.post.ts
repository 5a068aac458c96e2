import { z } from 'zod'
import { ruleDefSchema } from '#server/domain/diagnosis/knowledge-base'

const BodySchema = z.object({ finding: ruleDefSchema })

// Checks a finding as an editor holds it with the schema every stored finding passes; 400 with field errors.
export default defineApiHandler(async (event) => {
  await requireUser(event, 'knowledge:author')
  await readBodyAs(event, BodySchema)
  return { valid: true }
})
