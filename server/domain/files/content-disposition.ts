// Shared by every route that sends a file (uploads, report PDFs, outbox attachments).

/**
 * A Content-Disposition header that no file name can break: an ASCII fallback in quotes and the
 * exact UTF-8 name in RFC 6266/5987 form.
 */
export function contentDisposition(kind: 'inline' | 'attachment', name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\;]/g, '_') || 'file'
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encoded}`
}
