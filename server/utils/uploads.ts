// Reading an uploaded file from a multipart request. The checks and storage are the uploads
// service's (server/services/uploads.ts).
import type { H3Event } from 'h3'
import { UNSAFE_TEXT_MESSAGE, hasUnsafeCharacters } from '#shared/schemas/safe-text'
import { BadInputError, TooLargeError } from '#server/domain/errors'
import { TOO_LARGE_MESSAGE } from '#server/domain/uploads/upload-rules'
import { UploadFieldsSchema } from '#shared/schemas/uploads'
import { UPLOAD_MAX_BYTES, type UploadPurpose } from '#shared/utils/uploads'

// Multipart framing and the purpose field take well under this; the allowance keeps a file of
// exactly the limit acceptable while capping how much a request can make the server hold.
const FORM_OVERHEAD_BYTES = 64 * 1024

/** One uploaded file as the request carried it. */
export interface UploadForm {
  name: string
  bytes: Buffer
  purpose?: UploadPurpose
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
export async function readUploadForm(event: H3Event): Promise<UploadForm> {
  const form = await parseForm(event, await readCappedBody(event, UPLOAD_MAX_BYTES + FORM_OVERHEAD_BYTES))
  const files = form.getAll('file')
  if (!files.length) throw new BadInputError('No file was sent. Choose a photo or PDF (form field "file").')
  if (files.length > 1) throw new BadInputError('Send one file per upload.')
  const file = files[0]!
  if (typeof file === 'string') throw new BadInputError('The form field "file" must hold a file, not text.')
  if (hasUnsafeCharacters(file.name)) throw new BadInputError(`File name: ${UNSAFE_TEXT_MESSAGE.toLowerCase()}`, { file: [UNSAFE_TEXT_MESSAGE] })
  const fields = UploadFieldsSchema.safeParse({ purpose: form.get('purpose') || undefined })
  if (!fields.success) throw invalidInput(fields.error)
  return { name: file.name, bytes: Buffer.from(await file.arrayBuffer()), purpose: fields.data.purpose }
}
