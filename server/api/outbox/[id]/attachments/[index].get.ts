import { outboxAttachment } from '#server/services/outbox'
import { OutboxAttachmentParamsSchema } from '#shared/schemas/outbox'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'outbox:read')
  const { id, index } = await readParamsAs(event, OutboxAttachmentParamsSchema)
  const file = await outboxAttachment(actor, { messageId: id, index })
  // Always a download: an attachment's declared type is unchecked, and shown inline an HTML one
  // would run on this site's origin.
  setResponseHeaders(event, fileHeaders(file, { download: true, cache: 'private, no-store' }))
  return file.bytes
})
