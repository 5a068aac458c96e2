import imageCompression from 'browser-image-compression'
import { PHOTO_MAX_EDGE_PX } from '#shared/utils/uploads'

export { PHOTO_MAX_EDGE_PX }
/** Size a shrunk photo aims at, in MB. */
export const PHOTO_TARGET_MB = 1.5

const SHRINKABLE = new Set(['image/jpeg', 'image/png', 'image/webp'])

/** The name a shrunk photo is stored under: the same name with the extension of its new type. */
export function shrunkName(name: string, type: string): string {
  const ext = type === 'image/webp' ? 'webp' : type === 'image/png' ? 'png' : 'jpg'
  const base = name.replace(/\.[^./\\]+$/, '') || 'photo'
  return `${base}.${ext}`
}

/**
 * A phone photo made fit to send over a weak connection: at most PHOTO_MAX_EDGE_PX on its long edge
 * and about PHOTO_TARGET_MB, turned the right way up, its location and other metadata dropped. Runs
 * in the page itself (no worker script fetched from elsewhere). PDFs, files the browser cannot
 * decode (HEIC in most browsers: the server converts those), and photos already smaller than what shrinking gives are returned unchanged; the server
 * still checks whatever is sent.
 */
export async function shrinkPhoto(file: File): Promise<File> {
  if (!SHRINKABLE.has(file.type)) return file
  try {
    const type = file.type === 'image/png' ? 'image/jpeg' : file.type
    const shrunk = await imageCompression(file, {
      maxSizeMB: PHOTO_TARGET_MB, maxWidthOrHeight: PHOTO_MAX_EDGE_PX, useWebWorker: false, initialQuality: 0.85, fileType: type, preserveExif: false,
    })
    if (shrunk.size >= file.size) return file
    return new File([shrunk], shrunkName(file.name, type), { type, lastModified: file.lastModified })
  } catch {
    return file
  }
}
