import { updateFinding } from '#server/services/knowledge-drafts'
import { findingEditSchema, itemParamsSchema } from '#server/domain/knowledge/inputs'

// Replaces a finding of a draft; 409 when someone changed it since the sent lock version.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id, key } = await readParamsAs(event, itemParamsSchema)
  const input = await readBodyAs(event, findingEditSchema)
  return updateFinding(actor, { ...input, versionId: id, name: key }, new Date())
})
