import { createDraft } from '#server/services/knowledge-drafts'
import { newDraftSchema } from '#server/domain/knowledge/inputs'
import type { KbVersionDto } from '#shared/types/knowledge'

// Starts a draft copied from a version of the organisation (the published one unless `from` names another).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const input = await readBodyAs(event, newDraftSchema)
  const draft = await createDraft(actor, input, new Date())
  setResponseStatus(event, 201)
  return draft satisfies KbVersionDto
})
