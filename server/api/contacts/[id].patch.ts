import { updateContact } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'
import { ContactPatchSchema } from '#shared/schemas/equipment'
import type { ContactDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, ContactPatchSchema)
  return (await withDomainErrors(() => updateContact(user.organisationId, id, patch))) satisfies ContactDto
})
