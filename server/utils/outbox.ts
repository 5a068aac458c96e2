// Reads the messages the local SMTP fake stored as .eml files (runtimeConfig.smtp.outboxDir) for
// the admin Outbox. An admin sees only messages Rimecase sent for their own organisation: they are
// matched by Message-ID against the organisation's sent e-mails.
import { readdir, readFile, stat } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser'
import type { User } from '#auth-utils'
import { sentMessageIds } from '#server/db/repositories/emails'
import { isOutboxFileName, newestFirst, normaliseMessageId, outboxMessage, outboxSummary, type ParsedOutboxMail } from '#server/domain/outbox/outbox-message'
import type { OutboxMessageDto, OutboxSummaryDto } from '#shared/types/outbox'

interface Stored {
  mtimeMs: number
  fileDate: Date
  mail: ParsedOutboxMail
}

// Parsing every file on each list request would grow with the outbox; a parsed file is reused
// until its modification time changes. Bounded so a long-running server does not grow without end.
const CACHE_LIMIT = 1000
const parsedFiles = new Map<string, Stored>()

function outboxDir(): string {
  return resolve(useRuntimeConfig().smtp.outboxDir || '.data/outbox')
}

async function storedNames(dir: string): Promise<string[]> {
  try {
    return (await readdir(dir)).filter(isOutboxFileName)
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return []
    throw error
  }
}

const addressText = (a: AddressObject | AddressObject[] | undefined) => (Array.isArray(a) ? a.map((x) => x.text).join(', ') : a?.text)

function plain(mail: ParsedMail): ParsedOutboxMail {
  return {
    messageId: mail.messageId, date: mail.date, from: mail.from?.text, to: addressText(mail.to), subject: mail.subject, text: mail.text,
    attachments: mail.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, size: a.size })),
  }
}

async function parseFile(dir: string, name: string): Promise<{ parsed: ParsedMail; fileDate: Date; mtimeMs: number }> {
  const path = join(dir, name)
  const [info, raw] = await Promise.all([stat(path), readFile(path)])
  return { parsed: await simpleParser(raw, { skipHtmlToText: true }), fileDate: info.mtime, mtimeMs: info.mtimeMs }
}

async function loadSummary(dir: string, name: string): Promise<Stored | null> {
  try {
    const info = await stat(join(dir, name))
    const cached = parsedFiles.get(name)
    if (cached && cached.mtimeMs === info.mtimeMs) return cached
    const { parsed, fileDate, mtimeMs } = await parseFile(dir, name)
    const stored = { mtimeMs, fileDate, mail: plain(parsed) }
    if (parsedFiles.size >= CACHE_LIMIT) parsedFiles.delete(parsedFiles.keys().next().value!)
    parsedFiles.set(name, stored)
    return stored
  } catch {
    // A file being written or damaged is left out of the list rather than failing it.
    return null
  }
}

const ownedBy = (mail: ParsedOutboxMail, ids: Set<string>) => !!mail.messageId && ids.has(normaliseMessageId(mail.messageId))

/** The organisation's messages in the outbox, newest first. */
export async function listOutbox(user: User): Promise<OutboxSummaryDto[]> {
  const dir = outboxDir()
  const [names, ids] = await Promise.all([storedNames(dir), sentMessageIds(user.organisationId)])
  const items: OutboxSummaryDto[] = []
  for (const name of names) {
    const stored = await loadSummary(dir, name)
    if (stored && ownedBy(stored.mail, ids)) items.push(outboxSummary(name, stored.mail, stored.fileDate))
  }
  return items.sort(newestFirst)
}

// Opens a message only by a name that the folder listing itself returned.
async function openOwned(user: User, id: string): Promise<{ parsed: ParsedMail; fileDate: Date }> {
  const dir = outboxDir()
  if (!isOutboxFileName(id) || !(await storedNames(dir)).includes(id)) throw notFound('Message')
  let file: Awaited<ReturnType<typeof parseFile>>
  try {
    file = await parseFile(dir, id)
  } catch {
    throw createError({ status: 422, statusText: 'Unprocessable Entity', message: 'This stored message could not be read; it may be damaged.' })
  }
  if (!ownedBy(plain(file.parsed), await sentMessageIds(user.organisationId))) throw notFound('Message')
  return file
}

/** One message of the organisation with its text, or 404. */
export async function outboxMessageOr404(user: User, id: string): Promise<OutboxMessageDto> {
  const { parsed, fileDate } = await openOwned(user, id)
  return outboxMessage(id, plain(parsed), fileDate)
}

/** The bytes of one attachment of a message of the organisation, or 404. */
export async function outboxAttachmentOr404(user: User, id: string, index: number) {
  const { parsed } = await openOwned(user, id)
  const attachment = parsed.attachments[index]
  if (!attachment) throw notFound('Attachment')
  return { bytes: attachment.content, contentType: attachment.contentType, filename: attachment.filename || `attachment-${index + 1}` }
}
