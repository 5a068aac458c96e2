import { OutboxMessageParamsSchema } from '#shared/schemas/outbox'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'outbox:read')
  const { id } = await readParamsAs(event, OutboxMessageParamsSchema)
  return outboxMessageOr404(user, id)
})
