import { listAttemptsFor } from '#server/services/exercises'
import type { AttemptDto } from '#shared/types/training'

// The latest attempts: everyone's for trainers, one's own for others.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  return (await listAttemptsFor(actor, {})) satisfies AttemptDto[]
})
