import { contentDisposition } from '#server/domain/files/content-disposition'

/** A file a route sends back: its bytes, its real type and the name the browser saves it under. */
export interface ServedFile {
  bytes: Buffer
  mime: string
  name: string
}

/**
 * Response headers for sending a file: its real type, no sniffing, and a name that cannot break the
 * header. `download` makes it an attachment; `cache` defaults to an hour in the browser only.
 */
export function fileHeaders(file: ServedFile, options: { download: boolean; cache?: string }): Record<string, string> {
  return {
    'content-type': file.mime,
    'content-length': String(file.bytes.length),
    'content-disposition': contentDisposition(options.download ? 'attachment' : 'inline', file.name),
    'x-content-type-options': 'nosniff',
    'cache-control': options.cache ?? 'private, max-age=3600',
  }
}
