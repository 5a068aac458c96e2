import { z } from 'zod'

const id = z
  .string()
  .max(200, 'Unknown message')
  .regex(/^[\w.-]+\.eml$/, 'A message id is the name of a stored .eml file')

/** `GET /api/outbox`: search text (subject, addresses, body, attachment names) and page. */
export const OutboxListQuerySchema = z.object({
  q: z.string().trim().max(200, 'Keep the search under 200 characters').optional(),
  page: z.coerce.number({ error: 'Page must be a whole number' }).int('Page must be a whole number').min(1, 'Page must be 1 or more').max(100_000).default(1),
  pageSize: z.coerce.number({ error: 'Page size must be a whole number' }).int('Page size must be a whole number').min(1, 'Page size must be 1 or more').max(100, 'Page size must be 100 or fewer').default(20),
})
export type OutboxListQuery = z.infer<typeof OutboxListQuerySchema>

/** `GET /api/outbox/{id}`. */
export const OutboxMessageParamsSchema = z.object({ id })

/** `GET /api/outbox/{id}/attachments/{index}`. */
export const OutboxAttachmentParamsSchema = z.object({
  id,
  index: z.coerce.number({ error: 'Attachment index must be a whole number' }).int('Attachment index must be a whole number').min(0, 'Attachment index must be 0 or more').max(999),
})
