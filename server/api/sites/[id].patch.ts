import { updateSite } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import { SitePatchSchema } from '#shared/schemas/equipment'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, SitePatchSchema)
  return (await updateSite(actor, { siteId: id, patch })) satisfies SiteDto
})
