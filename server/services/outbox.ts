// Reads the messages the local SMTP fake stored as .eml files (runtimeConfig.smtp.outboxDir) for
// the admin Outbox. An admin sees only messages Rimecase sent for their own organisation: they are
// matched by Message-ID against the organisation's sent e-mails.
import { readdir, readFile, stat } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser'
import { sentMessageIds } from '#server/db/repositories/emails'
import { InvalidStateError, NotFoundError } from '#server/domain/errors'
import { isOutboxFileName, newestFirst, normaliseMessageId, outboxMatches, outboxMessage, outboxSummary, pageOf, type ParsedOutboxMail } from '#server/domain/outbox/outbox-message'
import type { OutboxListQuery } from '#shared/schemas/outbox'
import type { Page } from '#shared/types/equipment-dto'
import type { OutboxMessageDto, OutboxSummaryDto } from '#shared/types/outbox'
import type { ServedFile } from '#server/utils/file-response'
import type { Actor } from './types'

interface Stored {
  mtimeMs: number
  fileDate: Date
  mail: ParsedOutboxMail
}

// Parsing every file on each list request would grow with the outbox; a parsed file is reused
// while its modification time is the same (the time is part of the key). Files are per machine.
const parsedFiles = createCache<Stored>('parsed outbox files', { max: 1000 })

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
    return await parsedFiles.load(`${name}|${info.mtimeMs}`, async () => {
      const { parsed, fileDate, mtimeMs } = await parseFile(dir, name)
      return { mtimeMs, fileDate, mail: plain(parsed) }
    })
  } catch {
    // A file being written or damaged is left out of the list rather than failing it.
    return null
  }
}

const ownedBy = (mail: ParsedOutboxMail, ids: Set<string>) => !!mail.messageId && ids.has(normaliseMessageId(mail.messageId))

/** `GET /api/outbox`: one page of the organisation's messages matching the search, newest first. */
export async function listOutbox(actor: Actor, query: OutboxListQuery): Promise<Page<OutboxSummaryDto>> {
  const dir = outboxDir()
  const [names, ids] = await Promise.all([storedNames(dir), sentMessageIds(actor.organisationId)])
  const items: OutboxSummaryDto[] = []
  for (const name of names) {
    const stored = await loadSummary(dir, name)
    if (stored && ownedBy(stored.mail, ids) && outboxMatches(stored.mail, query.q)) items.push(outboxSummary(name, stored.mail, stored.fileDate))
  }
  return pageOf(items.sort(newestFirst), query.page, query.pageSize)
}

// Opens a message only by a name that the folder listing itself returned.
async function openOwned(actor: Actor, id: string): Promise<{ parsed: ParsedMail; fileDate: Date }> {
  const dir = outboxDir()
  if (!isOutboxFileName(id) || !(await storedNames(dir)).includes(id)) throw new NotFoundError('Message not found')
  let file: Awaited<ReturnType<typeof parseFile>>
  try {
    file = await parseFile(dir, id)
  } catch {
    throw new InvalidStateError('This stored message could not be read; it may be damaged.')
  }
  if (!ownedBy(plain(file.parsed), await sentMessageIds(actor.organisationId))) throw new NotFoundError('Message not found')
  return file
}

/** `GET /api/outbox/{id}`: one message of the organisation with its text, or 404. */
export async function outboxMessageOf(actor: Actor, input: { messageId: string }): Promise<OutboxMessageDto> {
  const { parsed, fileDate } = await openOwned(actor, input.messageId)
  return outboxMessage(input.messageId, plain(parsed), fileDate)
}

/** `GET /api/outbox/{id}/attachments/{index}`: the bytes of one attachment of a message of the organisation, or 404. */
export async function outboxAttachment(actor: Actor, input: { messageId: string; index: number }): Promise<ServedFile> {
  const { parsed } = await openOwned(actor, input.messageId)
  const attachment = parsed.attachments[input.index]
  if (!attachment) throw new NotFoundError('Attachment not found')
  return { bytes: attachment.content, mime: attachment.contentType, name: attachment.filename || `attachment-${input.index + 1}` }
}
