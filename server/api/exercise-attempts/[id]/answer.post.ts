import { answerAttempt } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import { AttemptAnswerSchema } from '#shared/schemas/training'
import type { AttemptDto } from '#shared/types/training'

// Only the trainee working the attempt names the causes; the attempt is scored at once.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, AttemptAnswerSchema)
  return (await answerAttempt(actor, { ...input, attemptId: id }, new Date())) satisfies AttemptDto
})
