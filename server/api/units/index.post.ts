import { createUnit } from '#server/services/equipment'
import { UnitInputSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const input = await readBodyAs(event, UnitInputSchema)
  const unit = await createUnit(actor, input)
  setResponseStatus(event, 201)
  return unit satisfies UnitDto
})
