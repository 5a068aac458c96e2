import { OutOfRangeError, UnitError, UnknownRefrigerantError } from '#shared/utils/properties'
import { BadInputError, ConflictError, FieldConflictError, FieldNotFoundError, ForbiddenError, InvalidStateError, NotFoundError, TooLargeError, UnsupportedTypeError } from '#server/domain/errors'

const STATUS: [new (...args: never[]) => Error, number, string][] = [
  [NotFoundError, 404, 'Not Found'],
  [ForbiddenError, 403, 'Forbidden'],
  [ConflictError, 409, 'Conflict'],
  [InvalidStateError, 422, 'Unprocessable Entity'],
  // The property module (shared with the browser) has its own error classes; they map here too.
  [UnknownRefrigerantError, 404, 'Not Found'],
  [OutOfRangeError, 422, 'Unprocessable Entity'],
  [UnitError, 400, 'Bad Request'],
  [BadInputError, 400, 'Bad Request'],
  [TooLargeError, 413, 'Content Too Large'],
  [UnsupportedTypeError, 415, 'Unsupported Media Type'],
]

/** Extra data a client can act on: the valid range of an out-of-range input, the allowed units. */
function dataOf(error: Error): Record<string, unknown> | undefined {
  if (error instanceof OutOfRangeError && (error.range || error.field)) {
    // Infinity is not JSON; an open end of a range is simply left out.
    const range = error.range ? { range: Object.fromEntries(Object.entries(error.range).filter(([, v]) => Number.isFinite(v))) } : {}
    return { ...range, ...(error.field ? { fieldErrors: { [error.field]: [error.message] } } : {}) }
  }
  if (error instanceof UnitError) return { allowed: error.allowed, fieldErrors: { unit: [error.message] } }
  // Field-tied errors carry the same `fieldErrors` shape as a 400, so forms place them beside the field.
  if (error instanceof FieldConflictError || error instanceof FieldNotFoundError) return { fieldErrors: { [error.field]: [error.message] } }
  return undefined
}

/** Maps a domain error to its HTTP error; anything else is rethrown unchanged. */
export function toHttpError(error: unknown): never {
  for (const [type, status, statusText] of STATUS) {
    if (!(error instanceof type)) continue
    const data = dataOf(error)
    throw createError({ status, statusText, message: error.message, ...(data ? { data } : {}) })
  }
  throw error
}

/** Runs `fn`, converting domain errors to HTTP errors in this one place. */
export async function withDomainErrors<T>(fn: () => Promise<T> | T): Promise<T> {
  try {
    return await fn()
  } catch (error) {
    return toHttpError(error)
  }
}

/** A 404 with the API's message shape. */
export function notFound(what: string) {
  return createError({ status: 404, statusText: 'Not Found', message: `${what} not found` })
}
