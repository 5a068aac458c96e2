// What an upload may be. The server enforces these (server/domain/uploads/upload-rules.ts) and
// the upload form states them, so both read the same numbers and words from here.

/**
 * Largest file accepted per upload, in bytes (25 MB): the app shrinks photos before sending, but a
 * full-size photo of a recent phone (up to about 20 MB) or a scanned certificate still fits.
 */
export const UPLOAD_MAX_BYTES = 25 * 1024 * 1024

/** Longest edge a photo keeps (the phone shrinks to it, the server converts HEIC to it): a nameplate or a brazed joint stays sharp, the upload stays small. */
export const PHOTO_MAX_EDGE_PX = 2560

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

/**
 * Photo types taken and turned into JPEG on the server before they are stored: HEIC/HEIF, what
 * iPhones take by default. Recognised by their bytes like the rest.
 */
export const UPLOAD_CONVERTED_TYPES = {
  'image/heic': 'HEIC',
  'image/heif': 'HEIF',
} as const

/** "JPEG, PNG, WebP, HEIC or PDF". */
export const UPLOAD_TYPES_TEXT = (() => {
  const names = [...Object.values(UPLOAD_TYPES).slice(0, -1), UPLOAD_CONVERTED_TYPES['image/heic'], Object.values(UPLOAD_TYPES).at(-1)]
  return `${names.slice(0, -1).join(', ')} or ${names.at(-1)}`
})()

/** What the file picker offers: the accepted types, HEIC/HEIF by type and by extension (browsers often leave their type empty). */
export const UPLOAD_ACCEPT = [...Object.keys(UPLOAD_TYPES), ...Object.keys(UPLOAD_CONVERTED_TYPES), '.heic', '.heif'].join(',')

/** What a file shows: a general photo, the unit's nameplate, or a document such as a certificate. */
export const UPLOAD_PURPOSES = ['photo', 'nameplate', 'document'] as const
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number]

/** True for the accepted content types. */
export function isUploadMime(mime: string | undefined): mime is UploadMime {
  return !!mime && Object.hasOwn(UPLOAD_TYPES, mime)
}

/** True for a photo type the server converts to JPEG before storing (HEIC/HEIF). */
export function isConvertedMime(mime: string | undefined): mime is keyof typeof UPLOAD_CONVERTED_TYPES {
  return !!mime && Object.hasOwn(UPLOAD_CONVERTED_TYPES, mime)
}

/** "2.4 MB" / "812 kB" / "96 B": a byte count for people. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} kB`
  return `${bytes} B`
}
