import { createCustomer } from '#server/services/equipment'
import { CustomerInputSchema } from '#shared/schemas/equipment'
import type { CustomerDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const input = await readBodyAs(event, CustomerInputSchema)
  const customer = await createCustomer(actor, input)
  setResponseStatus(event, 201)
  return customer satisfies CustomerDto
})
