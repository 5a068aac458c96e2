import { listPeople } from '#server/services/users'
import type { PersonDto } from '#shared/types/api'

// Names of the organisation's active people, for filters and pickers (no e-mail or account state).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  return (await listPeople(actor)) satisfies PersonDto[]
})
