import { requestInAttempt } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import { AttemptRequestSchema } from '#shared/schemas/training'
import type { AttemptDto } from '#shared/types/training'

// Only the trainee working the attempt asks for readings and tests.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, AttemptRequestSchema)
  return (await requestInAttempt(actor, { ...input, attemptId: id }, new Date())) satisfies AttemptDto
})
