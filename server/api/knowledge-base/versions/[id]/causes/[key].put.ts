import { updateCause } from '#server/services/knowledge-drafts'
import { causeEditSchema, itemParamsSchema } from '#server/domain/knowledge/inputs'

// Replaces a cause of a draft (title, short name, description, stages, starting weights).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id, key } = await readParamsAs(event, itemParamsSchema)
  const input = await readBodyAs(event, causeEditSchema)
  return updateCause(actor, { ...input, versionId: id, slug: key }, new Date())
})
