import { createUnit, findUnit } from '#server/db/repositories/equipment'
import { UnitInputSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const input = await readBodyAs(event, UnitInputSchema)
  const id = await withDomainErrors(() => createUnit(user.organisationId, input))
  setResponseStatus(event, 201)
  return (await findUnit(user.organisationId, id))! satisfies UnitDto
})
