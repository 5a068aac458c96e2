// Readiness probe for start scripts, tests and load balancers: 200 when the database answers, 503
// with the reason otherwise. Says nothing about any organisation.
import { checkHealth } from '#server/services/health'

export default defineApiHandler(async (event) => {
  const health = await checkHealth()
  if (health.ok) return { status: 'ok', db: true }
  setResponseStatus(event, 503, 'Service Unavailable')
  setResponseHeader(event, 'retry-after', 5)
  return { status: 'unavailable', reason: health.reason, db: false }
})
