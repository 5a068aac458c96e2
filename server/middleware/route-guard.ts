// Every /api request passes its route's rule (server/utils/route-rules.ts) before the handler runs.
export default defineEventHandler(async (event) => {
  if (!event.path.startsWith('/api/') && event.path !== '/api') return
  try {
    await enforceRouteRule(event)
  } catch (error) {
    setResponseHeaders(event, errorHeaders(error))
    throw toHttpError(error)
  }
})
