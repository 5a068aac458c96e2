import { getExercise } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import type { ExerciseDto } from '#shared/types/training'

// Any person of the organisation may read an exercise and work it.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getExercise(actor, { exerciseId: id })) satisfies ExerciseDto
})
