import { versionItems } from '#server/services/knowledge-drafts'
import { IdParamsSchema } from '#shared/schemas/common'

// A version's causes, tests and findings with the lock version each edit sends back.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return versionItems(actor, { versionId: id })
})
