// The local SMTP fake's messages as the Outbox shows them. Pure: the caller reads and parses the
// .eml files (server/utils/outbox.ts) and passes plain values in.
import type { OutboxAttachmentDto, OutboxMessageDto, OutboxSummaryDto } from '#shared/types/outbox'

/** Names the SMTP fake gives its files (scripts/lib/smtp.mjs); nothing else is ever opened. */
export const OUTBOX_FILE_NAME = /^[\w.-]+\.eml$/

/** True for a bare file name of the fake's pattern: no folder part, so no way out of the outbox. */
export function isOutboxFileName(name: string): boolean {
  return name.length <= 200 && OUTBOX_FILE_NAME.test(name) && name !== '.eml'
}

/** "<A@B>" and "a@b" name the same message. */
export function normaliseMessageId(id: string): string {
  return id.trim().replace(/^<|>$/g, '').toLowerCase()
}

/** What the parser gives for one message, reduced to plain values. */
export interface ParsedOutboxMail {
  messageId?: string
  date?: Date
  from?: string
  to?: string
  subject?: string
  text?: string
  attachments: { filename?: string; contentType: string; size: number }[]
}

// Long bodies are cut: the page shows a message to check it, not to archive it.
const MAX_TEXT = 100_000

/** The list entry of a stored message; `fileDate` stands in when the message has no Date header. */
export function outboxSummary(id: string, mail: ParsedOutboxMail, fileDate: Date): OutboxSummaryDto {
  const attachments: OutboxAttachmentDto[] = mail.attachments.map((a, index) => ({
    index,
    filename: a.filename || `attachment-${index + 1}`,
    contentType: a.contentType,
    size: a.size,
    url: `/api/outbox/${encodeURIComponent(id)}/attachments/${index}`,
  }))
  return {
    id,
    date: (mail.date && !Number.isNaN(mail.date.getTime()) ? mail.date : fileDate).toISOString(),
    from: mail.from ?? '',
    to: mail.to ?? '',
    subject: mail.subject ?? '(no subject)',
    attachments,
  }
}

/** The full view of a stored message. */
export function outboxMessage(id: string, mail: ParsedOutboxMail, fileDate: Date): OutboxMessageDto {
  const text = mail.text ?? ''
  return { ...outboxSummary(id, mail, fileDate), text: text.length > MAX_TEXT ? `${text.slice(0, MAX_TEXT)}\n…` : text }
}

/** Newest first; the file name (which starts with the time it was stored) breaks ties. */
export function newestFirst(a: OutboxSummaryDto, b: OutboxSummaryDto): number {
  return b.date.localeCompare(a.date) || b.id.localeCompare(a.id)
}

/**
 * True when every word of the search appears somewhere in the message: subject, sender, recipients,
 * body text or an attachment's name, without regard to case ("f-204 pdf" finds a report of F-204).
 */
export function outboxMatches(mail: ParsedOutboxMail, q: string | undefined): boolean {
  const words = (q ?? '').toLowerCase().split(/\s+/).filter(Boolean)
  if (!words.length) return true
  const haystack = [mail.subject, mail.from, mail.to, mail.text, ...mail.attachments.map((a) => a.filename)].filter(Boolean).join('\n').toLowerCase()
  return words.every((w) => haystack.includes(w))
}

/** One page of a list, with the total of all matches. */
export function pageOf<T>(items: T[], page: number, pageSize: number): { items: T[]; total: number; page: number; pageSize: number } {
  return { items: items.slice((page - 1) * pageSize, page * pageSize), total: items.length, page, pageSize }
}
