// Reading a data-logger CSV sent as the request body itself (not multipart), up to a size cap.
// A multipart form would be copied several times in memory; the raw body is held once.
import type { H3Event } from 'h3'
import { BadInputError, TooLargeError } from '#server/domain/errors'
import { MAX_LOGGER_BYTES } from './route-rules'

/** The largest logger file taken, bytes (the route's rule refuses larger bodies before this runs). */
export const LOGGER_MAX_BYTES = MAX_LOGGER_BYTES
export const LOGGER_TOO_LARGE = 'A logger file may be at most 64 MB. Export a shorter period, or fewer columns.'

/** Reads the CSV body (400 for a form or an empty body, 413 past the cap; the rest is drained so the client gets the answer). */
export function readLoggerBody(event: H3Event, cap = LOGGER_MAX_BYTES): Promise<Buffer> {
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (/^multipart\//i.test(type)) return Promise.reject(new BadInputError('Send the CSV file itself as the request body (Content-Type text/csv), not as a form.'))
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (declared > cap) return Promise.reject(new TooLargeError(LOGGER_TOO_LARGE))
  const req = event.node.req
  const empty = () => new BadInputError('The file is empty. Choose the CSV file the logger exported.', { file: ['The file is empty'] })
  // A body sent without a declared length was already read, within the limit, by the route guard.
  const read = (req as unknown as Record<symbol, Promise<Buffer> | undefined>)[Symbol.for('h3RawBody')]
  if (read) return read.then((bytes) => (bytes?.length ? bytes : Promise.reject(empty())))
  return new Promise((resolve, reject) => {
    // With a declared length the bytes go straight into one buffer of that size.
    const whole = Number.isFinite(declared) && declared > 0 ? Buffer.allocUnsafe(declared) : null
    const chunks: Buffer[] = []
    let total = 0
    const stop = () => void req.off('data', onData).off('end', onEnd).off('error', onError)
    const onData = (chunk: Buffer) => {
      if (total + chunk.length > cap || (whole && total + chunk.length > whole.length)) {
        stop()
        req.resume()
        return reject(total + chunk.length > cap ? new TooLargeError(LOGGER_TOO_LARGE) : new BadInputError('The body is longer than its Content-Length.'))
      }
      if (whole) chunk.copy(whole, total)
      else chunks.push(chunk)
      total += chunk.length
    }
    const onEnd = () => {
      stop()
      if (!total) return reject(empty())
      resolve(whole ? whole.subarray(0, total) : Buffer.concat(chunks))
    }
    const onError = () => {
      stop()
      reject(new BadInputError('The upload was interrupted before it finished. Try again.'))
    }
    req.on('data', onData).on('end', onEnd).on('error', onError)
  })
}
