// Receiving, checking, storing and serving uploaded photos and PDFs. The rules themselves are in
// server/domain/uploads/upload-rules.ts; this file does the I/O around them.
import { randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'
import { fileTypeFromBuffer } from 'file-type'
import sharp from 'sharp'
import type { User } from '#auth-utils'
import { appendEvents, readCaseState } from '#server/db/repositories/cases'
import { findUploadFile, insertUpload } from '#server/db/repositories/uploads'
import { BadInputError, InvalidStateError, NotFoundError, TooLargeError } from '#server/domain/errors'
import { contentDisposition } from '#server/domain/files/content-disposition'
import { TOO_LARGE_MESSAGE, assertCaseTakesUploads, checkUpload, cleanFileName, purposeFor } from '#server/domain/uploads/upload-rules'
import { UploadFieldsSchema } from '#shared/schemas/uploads'
import type { UploadDto } from '#shared/types/cases'
import { UPLOAD_MAX_BYTES, type UploadMime, type UploadPurpose } from '#shared/utils/uploads'

// Multipart framing and the purpose field take well under this; the allowance keeps a file of
// exactly the limit acceptable while capping how much a request can make the server hold.
const FORM_OVERHEAD_BYTES = 64 * 1024
const THUMB_WIDTH = 320
// A small PNG can declare a huge canvas; refuse to decode more than this many pixels.
const MAX_INPUT_PIXELS = 80_000_000

export interface UploadForm {
  name: string
  bytes: Buffer
  purpose?: UploadPurpose
}

interface PreparedUpload {
  mime: UploadMime
  bytes: Buffer
  name: string
  purpose: UploadPurpose
  thumb: Buffer | null
}

// Reads the body up to `cap` bytes. Past it, the rest is left to drain (not destroyed), so the
// client still receives the 413 instead of a reset connection.
function readCappedBody(event: H3Event, cap: number): Promise<Buffer> {
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (declared > cap) return Promise.reject(new TooLargeError(TOO_LARGE_MESSAGE))
  const req = event.node.req
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let total = 0
    const stop = () => {
      req.off('data', onData).off('end', onEnd).off('error', onError)
    }
    const onData = (chunk: Buffer) => {
      total += chunk.length
      if (total <= cap) return void chunks.push(chunk)
      stop()
      req.resume()
      reject(new TooLargeError(TOO_LARGE_MESSAGE))
    }
    const onEnd = () => {
      stop()
      resolve(Buffer.concat(chunks))
    }
    const onError = () => {
      stop()
      reject(new BadInputError('The upload was interrupted before it finished. Try again.'))
    }
    req.on('data', onData).on('end', onEnd).on('error', onError)
  })
}

async function parseForm(event: H3Event, body: Buffer): Promise<FormData> {
  const type = getRequestHeader(event, 'content-type') ?? ''
  const wrongShape = 'Send the file as multipart/form-data in a field named "file".'
  if (!/^multipart\/form-data\s*;/i.test(type)) throw new BadInputError(wrongShape)
  try {
    return await new Response(new Uint8Array(body), { headers: { 'content-type': type } }).formData()
  } catch {
    throw new BadInputError(`The upload could not be read. ${wrongShape}`)
  }
}

/** Reads one file (field `file`) and an optional `purpose` from a multipart request: 400/413 when that fails. */
export function readUploadForm(event: H3Event): Promise<UploadForm> {
  return withDomainErrors(async () => {
    const form = await parseForm(event, await readCappedBody(event, UPLOAD_MAX_BYTES + FORM_OVERHEAD_BYTES))
    const files = form.getAll('file')
    if (!files.length) throw new BadInputError('No file was sent. Choose a photo or PDF (form field "file").')
    if (files.length > 1) throw new BadInputError('Send one file per upload.')
    const file = files[0]!
    if (typeof file === 'string') throw new BadInputError('The form field "file" must hold a file, not text.')
    const fields = UploadFieldsSchema.safeParse({ purpose: form.get('purpose') || undefined })
    if (!fields.success) throw validationError(fields.error)
    return { name: file.name, bytes: Buffer.from(await file.arrayBuffer()), purpose: fields.data.purpose }
  })
}

async function thumbnailOf(bytes: Buffer): Promise<Buffer> {
  try {
    // rotate() applies the camera's orientation; the output carries no metadata (no location).
    return await sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS })
      .rotate()
      .resize({ width: THUMB_WIDTH, withoutEnlargement: true })
      .webp({ quality: 72 })
      .toBuffer()
  } catch {
    throw new InvalidStateError('The image could not be read; it may be damaged or cut short. Take or export it again.')
  }
}

async function prepare(form: UploadForm): Promise<PreparedUpload> {
  const detected = form.bytes.length ? (await fileTypeFromBuffer(form.bytes))?.mime : undefined
  const mime = checkUpload(form.bytes.length, detected)
  return {
    mime,
    bytes: form.bytes,
    name: cleanFileName(form.name, mime),
    purpose: purposeFor(mime, form.purpose),
    thumb: mime === 'application/pdf' ? null : await thumbnailOf(form.bytes),
  }
}

async function writeFiles(keys: { file: string; thumb: string }, prepared: PreparedUpload) {
  const storage = useStorage('uploads')
  try {
    await storage.setItemRaw(keys.file, prepared.bytes)
    if (prepared.thumb) await storage.setItemRaw(keys.thumb, prepared.thumb)
  } catch (error) {
    console.error('[uploads] storage write failed:', error instanceof Error ? error.message : error)
    await removeFiles(keys)
    throw createError({ status: 503, statusText: 'Service Unavailable', message: 'The file store is not reachable right now. Nothing was saved; try again in a moment.' })
  }
}

// Best effort: a leftover file without a database row is harmless, a lost row is not.
async function removeFiles(keys: { file: string; thumb: string }) {
  const storage = useStorage('uploads')
  for (const key of [keys.file, keys.thumb]) await storage.removeItem(key).catch(() => undefined)
}

/**
 * Checks, stores and records a file for a case or a unit. For a case, the row lock refuses a case
 * closed meanwhile (409) and a `photo` event joins the timeline in the same transaction.
 */
export function saveUpload(user: User, target: { caseId: number } | { unitId: number }, form: UploadForm): Promise<UploadDto> {
  return withDomainErrors(async () => {
    const prepared = await prepare(form)
    const keys = uploadKeys(user.organisationId, randomUUID())
    await writeFiles(keys, prepared)
    try {
      return await useDb().transaction(async (transaction) => {
        const caseId = 'caseId' in target ? target.caseId : null
        if (caseId !== null) {
          const current = await readCaseState(user.organisationId, caseId, transaction)
          if (!current) throw new NotFoundError('Case not found')
          assertCaseTakesUploads(current.status)
        }
        const saved = await insertUpload({
          organisationId: user.organisationId, caseId, unitId: 'unitId' in target ? target.unitId : null, purpose: prepared.purpose,
          mime: prepared.mime, bytes: prepared.bytes.length, originalName: prepared.name, storageKey: keys.file,
          thumbKey: prepared.thumb ? keys.thumb : null, uploadedBy: user.id,
        }, transaction)
        if (caseId !== null) {
          const payload = { uploadId: saved.id, name: saved.originalName, mime: saved.mime, purpose: saved.purpose }
          await appendEvents(caseId, user.id, [{ type: 'photo', payload }], transaction)
        }
        return saved
      })
    } catch (error) {
      await removeFiles(keys)
      throw error
    }
  })
}

export interface UploadFile {
  bytes: Buffer
  mime: string
  name: string
}

/** The bytes of an upload of the user's organisation (or its thumbnail), or 404. */
export async function uploadFileOr404(user: User, id: number, thumb: boolean): Promise<UploadFile> {
  const record = await findUploadFile(user.organisationId, id)
  if (!record) throw notFound('Upload')
  const key = thumb ? record.thumbKey : record.storageKey
  if (!key) throw createError({ status: 404, statusText: 'Not Found', message: 'This upload has no thumbnail; open the file itself.' })
  const raw = await useStorage('uploads').getItemRaw<ArrayBuffer | Uint8Array>(key)
  if (!raw) throw createError({ status: 404, statusText: 'Not Found', message: 'The stored file of this upload is missing.' })
  const bytes = Buffer.isBuffer(raw) ? raw : Buffer.from(raw instanceof Uint8Array ? raw : new Uint8Array(raw))
  return thumb
    ? { bytes, mime: 'image/webp', name: `${record.originalName.replace(/\.[^.]*$/, '')}-preview.webp` }
    : { bytes, mime: record.mime, name: record.originalName }
}

/** Response headers for serving a file: its real type, no sniffing, and a name that cannot break the header. */
export function uploadHeaders(file: UploadFile, download: boolean): Record<string, string> {
  return {
    'content-type': file.mime,
    'content-length': String(file.bytes.length),
    'content-disposition': contentDisposition(download ? 'attachment' : 'inline', file.name),
    'x-content-type-options': 'nosniff',
    'cache-control': 'private, max-age=3600',
  }
}
