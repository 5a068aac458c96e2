import { createContact } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'
import { ContactInputSchema } from '#shared/schemas/equipment'
import type { ContactDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, ContactInputSchema)
  const contact = await withDomainErrors(() => createContact(user.organisationId, id, input))
  setResponseStatus(event, 201)
  return contact satisfies ContactDto
})
