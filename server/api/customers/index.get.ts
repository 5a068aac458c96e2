import { listCustomers } from '#server/services/equipment'
import { CustomerListQuerySchema } from '#shared/schemas/equipment'
import type { CustomerDto, Page } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const query = await readQueryAs(event, CustomerListQuerySchema)
  return (await listCustomers(actor, query)) satisfies Page<CustomerDto>
})
