import { findCustomer } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CustomerDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const customer = await findCustomer(user.organisationId, id)
  if (!customer) throw notFound('Customer')
  return customer satisfies CustomerDto
})
