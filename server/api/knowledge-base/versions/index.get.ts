import { listKnowledgeBaseVersions } from '#server/services/knowledge'
import type { KbVersionDto } from '#shared/types/knowledge'

// Every knowledge-base version of the organisation, newest first.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  return (await listKnowledgeBaseVersions(actor)) satisfies KbVersionDto[]
})
