// Rules for uploaded files as plain functions: which bytes are accepted, what name is kept and
// how a download names the file. The route layer sniffs the content type and passes it in.
import { UPLOAD_MAX_BYTES, UPLOAD_MAX_TEXT, UPLOAD_TYPES_TEXT, isUploadMime, type UploadMime, type UploadPurpose } from '#shared/utils/uploads'
import { BadInputError, ConflictError, TooLargeError, UnsupportedTypeError } from '../errors'

/** Error text for a file over the limit; also used when the request body alone is too big. */
export const TOO_LARGE_MESSAGE = `The file is larger than the ${UPLOAD_MAX_TEXT} limit per file. Send a smaller photo or split the document.`

/**
 * Accepts a file of `size` bytes whose content was recognised as `detectedMime` (undefined when
 * nothing was recognised), and returns the type to store. The declared type and the name are
 * ignored on purpose: a renamed text file must not pass as a photo.
 */
export function checkUpload(size: number, detectedMime: string | undefined, maxBytes = UPLOAD_MAX_BYTES): UploadMime {
  checkSize(size, maxBytes)
  if (!isUploadMime(detectedMime)) {
    const seen = detectedMime ? `looks like ${detectedMime}` : 'is not a recognised photo or PDF'
    throw new UnsupportedTypeError(`This file ${seen}. Allowed: ${UPLOAD_TYPES_TEXT} (image/jpeg, image/png, image/webp, image/heic, application/pdf).`)
  }
  return detectedMime
}

/** Refuses an empty file or one over the limit, whatever its type. */
export function checkSize(size: number, maxBytes = UPLOAD_MAX_BYTES): void {
  if (size === 0) throw new BadInputError('The file is empty. Choose the photo or PDF again.')
  if (size > maxBytes) throw new TooLargeError(TOO_LARGE_MESSAGE)
}

/** The name a converted photo (an iPhone's IMG_0042.HEIC) is kept under: the same name as a JPEG. */
export function convertedName(name: string): string {
  return name.replace(/\.(heic|heif|hif)$/i, '') + '.jpg'
}

/** Photos and PDFs go on open cases only: a closed record stays as it was signed off. */
export function assertCaseTakesUploads(status: 'open' | 'closed'): void {
  if (status === 'closed') throw new ConflictError('This case is closed, so no more files can be added. Add an addendum if something changed.')
}

/** The purpose to record: the one given, else a guess from the type. */
export function purposeFor(mime: UploadMime, given: UploadPurpose | undefined): UploadPurpose {
  return given ?? (mime === 'application/pdf' ? 'document' : 'photo')
}

const EXTENSION: Record<UploadMime, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp', 'application/pdf': 'pdf' }

/**
 * The name kept for a file: the last path segment, without control or quote characters, at most
 * 200 characters (the column size), and a fallback when nothing usable is left.
 */
export function cleanFileName(name: string, mime: UploadMime): string {
  const base = name.split(/[\\/]/).pop() ?? ''
  const cleaned = base.replace(/[\u0000-\u001f\u007f"<>|*?]/g, '').replace(/\s+/g, ' ').trim()
  const safe = cleaned.replace(/^\.+/, '')
  if (!safe) return `upload.${EXTENSION[mime]}`
  return safe.length > 200 ? safe.slice(safe.length - 200) : safe
}
