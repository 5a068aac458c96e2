import { assignExercise } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import { AssigneesSchema } from '#shared/schemas/training'
import type { ExerciseSummaryDto } from '#shared/types/training'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'training:run')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { userIds } = await readBodyAs(event, AssigneesSchema)
  return (await assignExercise(actor, { exerciseId: id, userIds }, new Date())) satisfies ExerciseSummaryDto
})
