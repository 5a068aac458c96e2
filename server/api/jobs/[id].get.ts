import { getJob } from '#server/services/jobs'
import { JobParamsSchema } from '#shared/schemas/jobs'
import type { JobDto } from '#shared/types/jobs'

// The state, progress and result of a job the user's organisation started; 404 for any other id.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event)
  const { id } = await readParamsAs(event, JobParamsSchema)
  return (await getJob(actor, { jobId: id })) satisfies JobDto
})
