import { getCustomer } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CustomerDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getCustomer(actor, { customerId: id })) satisfies CustomerDto
})
