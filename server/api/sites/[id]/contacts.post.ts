import { createContact } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import { ContactInputSchema } from '#shared/schemas/equipment'
import type { ContactDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const contact = await readBodyAs(event, ContactInputSchema)
  const created = await createContact(actor, { siteId: id, contact })
  setResponseStatus(event, 201)
  return created satisfies ContactDto
})
