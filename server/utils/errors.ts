// The one error mapper: every HTTP status the API answers with is decided here, from the type of
// the error a service, a domain function or an input check threw. Handlers are wrapped by
// defineApiHandler (server/utils/api-handler.ts), which passes every error through toHttpError.
import { RankInputError } from '#server/domain/diagnosis/rank'
import {
  BadInputError, ConfirmationNeededError, ConflictError, ImplausibleInputError, FieldConflictError, FieldNotFoundError, ForbiddenError, InvalidStateError, NotFoundError, RateLimitedError, TooLargeError,
  UnauthenticatedError, UnavailableError, UnsupportedTypeError,
} from '#server/domain/errors'
import { isTransientDbError } from '#server/db/transient'
import { OutOfRangeError, UnitError, UnknownRefrigerantError } from '#shared/utils/properties'

type ErrorType = new (...args: never[]) => Error

// Most specific first: the first matching type decides.
const STATUS: [ErrorType, number, string][] = [
  [UnauthenticatedError, 401, 'Unauthorized'],
  [ForbiddenError, 403, 'Forbidden'],
  [NotFoundError, 404, 'Not Found'],
  [ConflictError, 409, 'Conflict'],
  [InvalidStateError, 422, 'Unprocessable Entity'],
  [BadInputError, 400, 'Bad Request'],
  [TooLargeError, 413, 'Content Too Large'],
  [UnsupportedTypeError, 415, 'Unsupported Media Type'],
  [RateLimitedError, 429, 'Too Many Requests'],
  [UnavailableError, 503, 'Service Unavailable'],
  // The property module (shared with the browser) and the ranking have their own error classes.
  [UnknownRefrigerantError, 404, 'Not Found'],
  [OutOfRangeError, 422, 'Unprocessable Entity'],
  [UnitError, 400, 'Bad Request'],
  [RankInputError, 400, 'Bad Request'],
]

/** Extra data a client can act on: field messages, the valid range of an out-of-range input, the allowed units. */
function dataOf(error: Error): Record<string, unknown> | undefined {
  if (error instanceof OutOfRangeError && (error.range || error.field)) {
    // Infinity is not JSON; an open end of a range is simply left out.
    const range = error.range ? { range: Object.fromEntries(Object.entries(error.range).filter(([, v]) => Number.isFinite(v))) } : {}
    return { ...range, ...(error.field ? { fieldErrors: { [error.field]: [error.message] } } : {}) }
  }
  if (error instanceof UnitError) return { allowed: error.allowed, fieldErrors: { unit: [error.message] } }
  if (error instanceof RankInputError) return { fieldErrors: { testResults: error.issues } }
  if (error instanceof BadInputError && error.fieldErrors) return { fieldErrors: error.fieldErrors }
  if (error instanceof ForbiddenError && error.fieldErrors) return { fieldErrors: error.fieldErrors }
  if (error instanceof RateLimitedError) return { retryAfterS: error.retryAfterS }
  if (error instanceof ConfirmationNeededError) return { fieldErrors: error.fieldErrors, confirmationNeeded: error.confirmationNeeded }
  if (error instanceof ImplausibleInputError) return { fieldErrors: error.fieldErrors }
  // Field-tied errors carry the same `fieldErrors` shape as a 400, so forms place them beside the field.
  if (error instanceof FieldConflictError || error instanceof FieldNotFoundError) return { fieldErrors: { [error.field]: [error.message] } }
  return undefined
}

/** Said when the database stays unreachable after the retries: the request may be sent again. */
export const DATABASE_UNAVAILABLE = 'The database cannot be reached right now. Try again in a moment.'
const DATABASE_RETRY_AFTER_S = 5

/** The HTTP status a domain error maps to (503 for a database that stays unreachable), or undefined for anything else. */
export function statusOf(error: unknown): number | undefined {
  return STATUS.find(([type]) => error instanceof type)?.[1] ?? (isTransientDbError(error) ? 503 : undefined)
}

/** Response headers that go with a domain error (how long to wait after a 429). */
export function errorHeaders(error: unknown): Record<string, string> {
  if (error instanceof RateLimitedError) return { 'retry-after': String(Math.max(1, Math.ceil(error.retryAfterS))) }
  if (!STATUS.some(([type]) => error instanceof type) && isTransientDbError(error)) return { 'retry-after': String(DATABASE_RETRY_AFTER_S) }
  return {}
}

/** Maps a domain error to its HTTP error; anything else (an h3 error, a bug) is returned unchanged. */
export function toHttpError(error: unknown): unknown {
  const entry = STATUS.find(([type]) => error instanceof type)
  if (!entry && isTransientDbError(error)) return createError({ status: 503, statusText: 'Service Unavailable', message: DATABASE_UNAVAILABLE })
  if (!entry) return error
  const [, status, statusText] = entry
  const data = dataOf(error as Error)
  return createError({ status, statusText, message: (error as Error).message, ...(data ? { data } : {}) })
}
