import { startAttempt } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import type { AttemptDto } from '#shared/types/training'

// Any person of the organisation may work an exercise.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const attempt = await startAttempt(actor, { exerciseId: id }, new Date())
  setResponseStatus(event, 201)
  return attempt satisfies AttemptDto
})
