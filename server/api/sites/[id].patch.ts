import { findSite, updateSite } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'
import { SitePatchSchema } from '#shared/schemas/equipment'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, SitePatchSchema)
  await withDomainErrors(() => updateSite(user.organisationId, id, patch))
  const site = await findSite(user.organisationId, id)
  if (!site) throw notFound('Site')
  return site satisfies SiteDto
})
