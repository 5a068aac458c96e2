import { updateContact } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import { ContactPatchSchema } from '#shared/schemas/equipment'
import type { ContactDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, ContactPatchSchema)
  return (await updateContact(actor, { contactId: id, patch })) satisfies ContactDto
})
