import { getAttempt } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import type { AttemptDto } from '#shared/types/training'

// The trainee's own attempt, or anyone's for trainers.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getAttempt(actor, { attemptId: id })) satisfies AttemptDto
})
