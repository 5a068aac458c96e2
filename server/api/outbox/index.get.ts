import { listOutbox } from '#server/services/outbox'
import type { OutboxSummaryDto } from '#shared/types/outbox'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'outbox:read')
  return (await listOutbox(actor)) satisfies OutboxSummaryDto[]
})
