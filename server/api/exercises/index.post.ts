import { createExercise } from '#server/services/exercises'
import { NewExerciseSchema } from '#shared/schemas/training'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'training:run')
  const input = await readBodyAs(event, NewExerciseSchema)
  const created = await createExercise(actor, input, new Date())
  setResponseStatus(event, 201)
  return created satisfies { id: number }
})
