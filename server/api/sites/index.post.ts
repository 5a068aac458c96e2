import { createSite } from '#server/services/equipment'
import { SiteInputSchema } from '#shared/schemas/equipment'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const input = await readBodyAs(event, SiteInputSchema)
  const site = await createSite(actor, input)
  setResponseStatus(event, 201)
  return site satisfies SiteDto
})
