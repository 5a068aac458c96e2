import { deleteContact } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  await deleteContact(actor, { contactId: id })
  setResponseStatus(event, 204)
  return null
})
