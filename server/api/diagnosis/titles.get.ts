import { knowledgeBaseTitles } from '#server/services/diagnosis'
import type { KnowledgeBaseTitles } from '#shared/utils/vocabulary'

// The titles the published knowledge base gives its causes, tests and outcomes: labels of words the
// shared vocabulary has no entry for yet fall back to these.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:read')
  return (await knowledgeBaseTitles(actor.organisationId, actor.cacheStamps)) satisfies KnowledgeBaseTitles
})
