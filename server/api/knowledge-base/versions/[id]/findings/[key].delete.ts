import { removeFinding } from '#server/services/knowledge-drafts'
import { deleteQuerySchema, itemParamsSchema } from '#server/domain/knowledge/inputs'

// Removes a finding from a draft; 409 when someone changed it since the sent lock version.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id, key } = await readParamsAs(event, itemParamsSchema)
  const { lockVersion } = await readQueryAs(event, deleteQuerySchema)
  await removeFinding(actor, { versionId: id, name: key, lockVersion }, new Date())
  setResponseStatus(event, 204)
  return null
})
