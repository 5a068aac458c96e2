import { startAccuracy } from '#server/services/accuracy'

// Re-ranks every confirmed case, so it runs as a background job; follow it at GET /api/jobs/{id}.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'training:run')
  const started = await startAccuracy(actor)
  setResponseStatus(event, 202)
  return started satisfies { jobId: string }
})
