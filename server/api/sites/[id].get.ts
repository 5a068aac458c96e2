import { getSite } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getSite(actor, { siteId: id })) satisfies SiteDto
})
