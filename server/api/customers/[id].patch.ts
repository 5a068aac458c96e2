import { findCustomer, updateCustomer } from '#server/db/repositories/customers'
import { IdParamsSchema } from '#shared/schemas/common'
import { CustomerPatchSchema } from '#shared/schemas/equipment'
import type { CustomerDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, CustomerPatchSchema)
  await withDomainErrors(() => updateCustomer(user.organisationId, id, patch))
  const customer = await findCustomer(user.organisationId, id)
  if (!customer) throw notFound('Customer')
  return customer satisfies CustomerDto
})
