import { findSite } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const site = await findSite(user.organisationId, id)
  if (!site) throw notFound('Site')
  return site satisfies SiteDto
})
