// Photos and PDFs of a case or a unit: checked by content (server/domain/uploads/upload-rules.ts),
// stored in the "uploads" storage mount, recorded in the database, and served back only to the
// organisation that owns them.
import { randomUUID } from 'node:crypto'
import { fileTypeFromBuffer } from 'file-type'
import decodeHeic from 'heic-decode'
import sharp from 'sharp'
import { readCaseState } from '#server/db/repositories/case-records'
import { appendEvents } from '#server/db/repositories/case-writes'
import { findUploadFile, insertUpload } from '#server/db/repositories/uploads'
import { InvalidStateError, NotFoundError, UnavailableError } from '#server/domain/errors'
import { assertCaseTakesUploads, checkSize, checkUpload, cleanFileName, convertedName, purposeFor } from '#server/domain/uploads/upload-rules'
import type { UploadDto } from '#shared/types/uploads'
import type { ServedFile } from '#server/utils/file-response'
import type { UploadForm } from '#server/utils/uploads'
import { PHOTO_MAX_EDGE_PX, isConvertedMime, type UploadMime, type UploadPurpose } from '#shared/utils/uploads'
import { getCase } from './cases'
import { getUnit } from './equipment'
import type { Actor } from './types'

const THUMB_WIDTH = 320
// A small PNG can declare a huge canvas; refuse to decode more than this many pixels.
const MAX_INPUT_PIXELS = 80_000_000

interface PreparedUpload {
  mime: UploadMime
  bytes: Buffer
  name: string
  purpose: UploadPurpose
  thumb: Buffer | null
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

/**
 * An iPhone's HEIC/HEIF photo as a JPEG the app, the PDF report and every browser can show: decoded
 * with libheif (heic-decode, WebAssembly, nothing fetched), turned the right way up by the file's own
 * rotation, at most PHOTO_MAX_EDGE_PX on its long edge, metadata (location) dropped.
 */
async function heifToJpeg(bytes: Buffer): Promise<Buffer> {
  let image: { width: number; height: number; data: Uint8ClampedArray }
  try {
    image = await decodeHeic({ buffer: bytes })
  } catch {
    throw new InvalidStateError('The HEIC photo could not be read; it may be damaged or cut short. Take or export it again.')
  }
  if (image.width * image.height > MAX_INPUT_PIXELS) throw new InvalidStateError('The HEIC photo is larger than any camera takes; export it smaller.')
  return sharp(Buffer.from(image.data.buffer, image.data.byteOffset, image.data.byteLength), { raw: { width: image.width, height: image.height, channels: 4 } })
    .resize({ width: PHOTO_MAX_EDGE_PX, height: PHOTO_MAX_EDGE_PX, fit: 'inside', withoutEnlargement: true })
    .jpeg({ quality: 85 })
    .toBuffer()
}

async function prepare(form: UploadForm): Promise<PreparedUpload> {
  const sniffed = form.bytes.length ? (await fileTypeFromBuffer(form.bytes))?.mime : undefined
  // HEIC/HEIF, known by its bytes (never by the name), is stored as the JPEG made of it.
  const heif = isConvertedMime(sniffed)
  if (heif) checkSize(form.bytes.length)
  const bytes = heif ? await heifToJpeg(form.bytes) : form.bytes
  const detected = heif ? (await fileTypeFromBuffer(bytes))?.mime : sniffed
  const mime = checkUpload(bytes.length, detected)
  return {
    mime,
    bytes,
    name: cleanFileName(heif ? convertedName(form.name) : form.name, mime),
    purpose: purposeFor(mime, form.purpose),
    thumb: mime === 'application/pdf' ? null : await thumbnailOf(bytes),
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
    throw new UnavailableError('The file store is not reachable right now. Nothing was saved; try again in a moment.')
  }
}

// Best effort: a leftover file without a database row is harmless, a lost row is not.
async function removeFiles(keys: { file: string; thumb: string }) {
  const storage = useStorage('uploads')
  for (const key of [keys.file, keys.thumb]) await storage.removeItem(key).catch(() => undefined)
}

/**
 * Checks, stores and records a file. For a case, the row lock refuses a case closed meanwhile (409)
 * and a `photo` event joins the timeline in the same transaction.
 */
async function store(actor: Actor, target: { caseId: number } | { unitId: number }, form: UploadForm, now: Date): Promise<UploadDto> {
  const prepared = await prepare(form)
  const keys = uploadKeys(actor.organisationId, randomUUID())
  await writeFiles(keys, prepared)
  try {
    return await useDb().transaction(async (transaction) => {
      const caseId = 'caseId' in target ? target.caseId : null
      if (caseId !== null) {
        const current = await readCaseState(actor.organisationId, caseId, transaction)
        if (!current) throw new NotFoundError('Case not found')
        assertCaseTakesUploads(current.status)
      }
      const saved = await insertUpload({
        organisationId: actor.organisationId, caseId, unitId: 'unitId' in target ? target.unitId : null, purpose: prepared.purpose,
        mime: prepared.mime, bytes: prepared.bytes.length, originalName: prepared.name, storageKey: keys.file,
        thumbKey: prepared.thumb ? keys.thumb : null, uploadedBy: actor.id,
      }, transaction)
      if (caseId !== null) {
        const payload = { uploadId: saved.id, name: saved.originalName, mime: saved.mime, purpose: saved.purpose }
        await appendEvents(caseId, actor.id, [{ type: 'photo', payload }], transaction, now)
      }
      return saved
    })
  } catch (error) {
    await removeFiles(keys)
    throw error
  }
}

/** Refuses an upload to a case that is not the organisation's (404) or is closed (409), before its bytes are read. */
export async function assertCaseTakesFiles(actor: Actor, input: { caseId: number }): Promise<void> {
  assertCaseTakesUploads((await getCase(actor, input)).status)
}

/** Refuses an upload to a unit that is not the organisation's (404), before its bytes are read. */
export async function assertUnitTakesFiles(actor: Actor, input: { unitId: number }): Promise<void> {
  await getUnit(actor, input)
}

/** `POST /api/cases/{id}/uploads`: a photo or PDF for an open case. */
export function addCaseFile(actor: Actor, input: { caseId: number; file: UploadForm }, now: Date): Promise<UploadDto> {
  return store(actor, { caseId: input.caseId }, input.file, now)
}

/** `POST /api/units/{id}/uploads`: a file about the unit itself (nameplate, certificate). */
export function addUnitFile(actor: Actor, input: { unitId: number; file: UploadForm }, now: Date): Promise<UploadDto> {
  return store(actor, { unitId: input.unitId }, input.file, now)
}

/** `GET /api/uploads/{id}`: the bytes of an upload of the organisation (or its preview), or 404. */
export async function uploadFile(actor: Actor, input: { uploadId: number; thumb: boolean }): Promise<ServedFile> {
  const record = await findUploadFile(actor.organisationId, input.uploadId)
  if (!record) throw new NotFoundError('Upload not found')
  const key = input.thumb ? record.thumbKey : record.storageKey
  if (!key) throw new NotFoundError('This upload has no thumbnail; open the file itself.')
  const raw = await useStorage('uploads').getItemRaw<ArrayBuffer | Uint8Array>(key)
  if (!raw) throw new NotFoundError('The stored file of this upload is missing.')
  const bytes = Buffer.isBuffer(raw) ? raw : Buffer.from(raw instanceof Uint8Array ? raw : new Uint8Array(raw))
  return input.thumb
    ? { bytes, mime: 'image/webp', name: `${record.originalName.replace(/\.[^.]*$/, '')}-preview.webp` }
    : { bytes, mime: record.mime, name: record.originalName }
}
