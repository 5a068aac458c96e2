import { listOutbox } from '#server/services/outbox'
import { OutboxListQuerySchema } from '#shared/schemas/outbox'
import type { Page } from '#shared/types/equipment-dto'
import type { OutboxSummaryDto } from '#shared/types/outbox'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'outbox:read')
  const query = await readQueryAs(event, OutboxListQuerySchema)
  return (await listOutbox(actor, query)) satisfies Page<OutboxSummaryDto>
})
