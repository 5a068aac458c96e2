import type { H3Event } from 'h3'
import type { ZodError, ZodType } from 'zod'
import { BadInputError } from '#server/domain/errors'
import { SafeInputSchema } from '#shared/schemas/safe-text'
import { zodFieldErrors, zodSummary } from '#shared/utils/input-errors'

/** The API's 400 for input that fails its schema: field messages by path, and a summary naming the field in words. */
export function invalidInput(error: ZodError): BadInputError {
  return new BadInputError(zodSummary(error), zodFieldErrors(error))
}

async function check<T>(read: Promise<{ success: true; data: T } | { success: false; error: ZodError }>): Promise<T> {
  let result: Awaited<typeof read>
  try {
    result = await read
  } catch (error) {
    // e.g. a body that is not JSON: keep the 400 and give it the same shape as field errors.
    const h3 = error as { statusCode?: number; message?: string }
    if (h3.statusCode === 400) {
      const message = h3.message || 'The request could not be read'
      throw new BadInputError(message, { _: [message] })
    }
    throw error
  }
  if (!result.success) throw invalidInput(result.error)
  return result.data
}

/**
 * Every input first passes the shared refinement that refuses NUL characters and lone surrogates
 * in any string (400 naming the field), then its own schema.
 */
function safeParse<T>(schema: ZodType<T>, value: unknown) {
  const safe = SafeInputSchema.safeParse(value)
  return safe.success ? schema.safeParse(value) : (safe as { success: false; error: ZodError })
}

/** Reads and validates the JSON body with `schema` (400 with field errors when it fails). */
export function readBodyAs<T>(event: H3Event, schema: ZodType<T>): Promise<T> {
  return check(readValidatedBody(event, (body) => safeParse(schema, body ?? {})))
}

/** Validates the query string with `schema`. */
export function readQueryAs<T>(event: H3Event, schema: ZodType<T>): Promise<T> {
  return check(getValidatedQuery(event, (query) => safeParse(schema, query)))
}

/** Validates the route parameters with `schema`. */
export function readParamsAs<T>(event: H3Event, schema: ZodType<T>): Promise<T> {
  return check(getValidatedRouterParams(event, (params) => safeParse(schema, params)))
}

/** Validates a value the server assembled (e.g. a patch merged onto a saved record) with the API's 400. */
export function parseAs<T>(schema: ZodType<T>, value: unknown): T {
  const result = safeParse(schema, value)
  if (!result.success) throw invalidInput(result.error)
  return result.data
}
