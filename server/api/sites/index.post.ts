import { createSite, findSite } from '#server/db/repositories/customers'
import { SiteInputSchema } from '#shared/schemas/equipment'
import type { SiteDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const input = await readBodyAs(event, SiteInputSchema)
  const id = await withDomainErrors(() => createSite(user.organisationId, input))
  setResponseStatus(event, 201)
  return (await findSite(user.organisationId, id))! satisfies SiteDto
})
