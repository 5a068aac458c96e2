import { contentDisposition } from '#server/domain/files/content-disposition'
import { OutboxAttachmentParamsSchema } from '#shared/schemas/outbox'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'outbox:read')
  const { id, index } = await readParamsAs(event, OutboxAttachmentParamsSchema)
  const file = await outboxAttachmentOr404(user, id, index)
  // Always a download: an attachment's declared type is unchecked, and shown inline an HTML one
  // would run on this site's origin.
  setResponseHeaders(event, {
    'content-type': file.contentType,
    'content-length': file.bytes.length,
    'content-disposition': contentDisposition('attachment', file.filename),
    'x-content-type-options': 'nosniff',
    'cache-control': 'private, no-store',
  })
  return file.bytes
})
