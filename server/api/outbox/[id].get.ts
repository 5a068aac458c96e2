import { outboxMessageOf } from '#server/services/outbox'
import { OutboxMessageParamsSchema } from '#shared/schemas/outbox'
import type { OutboxMessageDto } from '#shared/types/outbox'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'outbox:read')
  const { id } = await readParamsAs(event, OutboxMessageParamsSchema)
  return (await outboxMessageOf(actor, { messageId: id })) satisfies OutboxMessageDto
})
