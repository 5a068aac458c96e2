import { createCustomer, findCustomer } from '#server/db/repositories/customers'
import { CustomerInputSchema } from '#shared/schemas/equipment'
import type { CustomerDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const input = await readBodyAs(event, CustomerInputSchema)
  const id = await withDomainErrors(() => createCustomer(user.organisationId, input))
  setResponseStatus(event, 201)
  return (await findCustomer(user.organisationId, id))! satisfies CustomerDto
})
