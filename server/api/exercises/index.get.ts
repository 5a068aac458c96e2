import { listExercisesFor } from '#server/services/exercises'
import type { ExerciseSummaryDto } from '#shared/types/training'

// Trainers see every exercise of the organisation; others those assigned to them or tried by them.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  return (await listExercisesFor(actor)) satisfies ExerciseSummaryDto[]
})
