import { deleteContact } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  await withDomainErrors(() => deleteContact(user.organisationId, id))
  setResponseStatus(event, 204)
  return null
})
