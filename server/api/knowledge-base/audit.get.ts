import { auditLog } from '#server/services/knowledge-drafts'
import { auditQuerySchema } from '#server/domain/knowledge/inputs'

// Every knowledge-base change of the organisation: who, when, what; newest first.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const query = await readQueryAs(event, auditQuerySchema)
  return auditLog(actor, query)
})
