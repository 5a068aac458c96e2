import { getKnowledgeBaseVersion } from '#server/services/knowledge'
import { IdParamsSchema } from '#shared/schemas/common'
import type { KbVersionDto } from '#shared/types/knowledge'

// One knowledge-base version of the organisation: status, who made, reviewed and published it.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getKnowledgeBaseVersion(actor, { versionId: id })) satisfies KbVersionDto
})
