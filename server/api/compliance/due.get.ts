import { dueList } from '#server/services/refrigerant-log'
import { DueQuerySchema } from '#shared/schemas/refrigerant-log'
import type { DueListDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const query = await readQueryAs(event, DueQuerySchema)
  return (await dueList(actor, query, new Date())) satisfies DueListDto
})
