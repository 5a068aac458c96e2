import { publishVersion } from '#server/services/knowledge-drafts'
import { IdParamsSchema } from '#shared/schemas/common'
import type { KbVersionDto } from '#shared/types/knowledge'

// Publishes an approved version, or an earlier one again (rollback), in one transaction.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await publishVersion(actor, { versionId: id }, new Date())) satisfies KbVersionDto
})
