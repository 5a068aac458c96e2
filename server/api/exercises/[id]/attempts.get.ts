import { listAttemptsFor } from '#server/services/exercises'
import { IdParamsSchema } from '#shared/schemas/common'
import type { AttemptDto } from '#shared/types/training'

// Trainers see everyone's attempts at the exercise; others only their own.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await listAttemptsFor(actor, { exerciseId: id })) satisfies AttemptDto[]
})
