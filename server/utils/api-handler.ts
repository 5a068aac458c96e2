import type { EventHandlerRequest, H3Event } from 'h3'

/**
 * Defines an API route whose errors are mapped in one place: a handler (and the services it calls)
 * throws domain errors, and toHttpError turns them into the API's statuses. Every route under
 * server/api uses this instead of defineEventHandler.
 */
export function defineApiHandler<T>(handler: (event: H3Event<EventHandlerRequest>) => T | Promise<T>) {
  return defineEventHandler(async (event) => {
    try {
      return await handler(event)
    } catch (error) {
      setResponseHeaders(event, errorHeaders(error))
      throw toHttpError(error)
    }
  })
}
