import { listCustomers } from '#server/db/repositories/customers'
import { CustomerListQuerySchema } from '#shared/schemas/equipment'
import type { CustomerDto, Page } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const query = await readQueryAs(event, CustomerListQuerySchema)
  const { items, total } = await listCustomers(user.organisationId, query)
  return { items, total, page: query.page, pageSize: query.pageSize } satisfies Page<CustomerDto>
})
