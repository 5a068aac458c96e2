import { listUnits } from '#server/db/repositories/equipment'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  return listUnits(user.organisationId)
})
