import { listSites } from '#server/services/equipment'
import { SiteListQuerySchema } from '#shared/schemas/equipment'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const query = await readQueryAs(event, SiteListQuerySchema)
  return (await listSites(actor, query)) satisfies SiteDto[]
})
