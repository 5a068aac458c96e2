import { ConflictError, FieldConflictError, FieldNotFoundError, ForbiddenError, InvalidStateError, NotFoundError } from '#server/domain/errors'

const STATUS: [new (...args: never[]) => Error, number, string][] = [
  [NotFoundError, 404, 'Not Found'],
  [ForbiddenError, 403, 'Forbidden'],
  [ConflictError, 409, 'Conflict'],
  [InvalidStateError, 422, 'Unprocessable Entity'],
]

/** Maps a domain error to its HTTP error; anything else is rethrown unchanged. */
export function toHttpError(error: unknown): never {
  for (const [type, status, statusText] of STATUS) {
    if (!(error instanceof type)) continue
    // Field-tied errors carry the same `fieldErrors` shape as a 400, so forms place them beside the field.
    const field = error instanceof FieldConflictError || error instanceof FieldNotFoundError ? error.field : null
    throw createError({ status, statusText, message: error.message, ...(field ? { data: { fieldErrors: { [field]: [error.message] } } } : {}) })
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
