import { reviewVersion } from '#server/services/knowledge-drafts'
import { reviewSchema } from '#server/domain/knowledge/inputs'
import { IdParamsSchema } from '#shared/schemas/common'
import type { KbVersionDto } from '#shared/types/knowledge'

// Approves a version in review, or returns it to draft with comments; never by its author (403).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, reviewSchema)
  return (await reviewVersion(actor, { ...input, versionId: id }, new Date())) satisfies KbVersionDto
})
