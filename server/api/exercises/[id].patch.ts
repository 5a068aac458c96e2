import { changeExercise } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import { UpdateExerciseSchema } from '#shared/schemas/training'
import type { ExerciseDto } from '#shared/types/training'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'training:run')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, UpdateExerciseSchema)
  return (await changeExercise(actor, { ...input, exerciseId: id })) satisfies ExerciseDto
})
