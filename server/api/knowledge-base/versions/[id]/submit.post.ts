import { submitForReview } from '#server/services/knowledge-drafts'
import { submitSchema } from '#server/domain/knowledge/inputs'
import { IdParamsSchema } from '#shared/schemas/common'
import type { KbVersionDto } from '#shared/types/knowledge'

// Sends a draft for review by another engineer or an administrator.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { revision } = await readBodyAs(event, submitSchema)
  return (await submitForReview(actor, { versionId: id, revision }, new Date())) satisfies KbVersionDto
})
