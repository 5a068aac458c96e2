import { updateTest } from '#server/services/knowledge-drafts'
import { itemParamsSchema, testEditSchema } from '#server/domain/knowledge/inputs'

// Replaces a test of a draft (procedure, cautions, cost, outcomes and their likelihoods).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id, key } = await readParamsAs(event, itemParamsSchema)
  const input = await readBodyAs(event, testEditSchema)
  return updateTest(actor, { ...input, versionId: id, slug: key }, new Date())
})
