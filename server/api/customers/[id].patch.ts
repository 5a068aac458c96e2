import { updateCustomer } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import { CustomerPatchSchema } from '#shared/schemas/equipment'
import type { CustomerDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, CustomerPatchSchema)
  return (await updateCustomer(actor, { customerId: id, patch })) satisfies CustomerDto
})
