// What an upload may be. The server enforces these (server/domain/uploads/upload-rules.ts) and
// the upload form states them, so both read the same numbers and words from here.

/**
 * Largest file accepted per upload, in bytes (25 MB): the app shrinks photos before sending, but a
 * full-size photo of a recent phone (up to about 20 MB) or a scanned certificate still fits.
 */
export const UPLOAD_MAX_BYTES = 25 * 1024 * 1024

/** The limit as people read it. */
export const UPLOAD_MAX_TEXT = '25 MB'

/** Content types accepted, with the name people know each by. Checked against the bytes, not the file name. */
export const UPLOAD_TYPES = {
  'image/jpeg': 'JPEG',
  'image/png': 'PNG',
  'image/webp': 'WebP',
  'application/pdf': 'PDF',
} as const

export type UploadMime = keyof typeof UPLOAD_TYPES

/** "JPEG, PNG, WebP or PDF". */
export const UPLOAD_TYPES_TEXT = (() => {
  const names = Object.values(UPLOAD_TYPES)
  return `${names.slice(0, -1).join(', ')} or ${names.at(-1)}`
})()

/** What a file shows: a general photo, the unit's nameplate, or a document such as a certificate. */
export const UPLOAD_PURPOSES = ['photo', 'nameplate', 'document'] as const
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number]

/** True for the accepted content types. */
export function isUploadMime(mime: string | undefined): mime is UploadMime {
  return !!mime && Object.hasOwn(UPLOAD_TYPES, mime)
}

/** "2.4 MB" / "812 kB" / "96 B": a byte count for people. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} kB`
  return `${bytes} B`
}
