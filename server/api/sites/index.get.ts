import { listSites } from '#server/db/repositories/customers'
import { SiteListQuerySchema } from '#shared/schemas/equipment'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const { customerId } = await readQueryAs(event, SiteListQuerySchema)
  return (await listSites(user.organisationId, customerId)) satisfies SiteDto[]
})
