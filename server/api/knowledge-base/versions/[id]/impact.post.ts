import { startImpact } from '#server/services/knowledge'
import { IdParamsSchema } from '#shared/schemas/common'
import type { ImpactJobDto } from '#shared/types/knowledge'

// Replays the organisation's closed cases with this version and the published one, as a job.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const started = await startImpact(actor, { versionId: id })
  setResponseStatus(event, 202)
  return started satisfies ImpactJobDto
})
