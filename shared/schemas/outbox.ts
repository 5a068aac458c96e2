import { z } from 'zod'

const id = z
  .string()
  .max(200, 'Unknown message')
  .regex(/^[\w.-]+\.eml$/, 'A message id is the name of a stored .eml file')

/** `GET /api/outbox/{id}`. */
export const OutboxMessageParamsSchema = z.object({ id })

/** `GET /api/outbox/{id}/attachments/{index}`. */
export const OutboxAttachmentParamsSchema = z.object({
  id,
  index: z.coerce.number({ error: 'Attachment index must be a whole number' }).int('Attachment index must be a whole number').min(0, 'Attachment index must be 0 or more').max(999),
})
