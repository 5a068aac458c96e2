/** An attachment of a message caught by the local SMTP fake. */
export interface OutboxAttachmentDto {
  index: number
  filename: string
  contentType: string
  size: number
  url: string
}

/** A message in the outbox list. `id` is the stored file's name. */
export interface OutboxSummaryDto {
  id: string
  date: string
  from: string
  to: string
  subject: string
  attachments: OutboxAttachmentDto[]
}

/** One message with its plain-text body. */
export interface OutboxMessageDto extends OutboxSummaryDto {
  text: string
}
