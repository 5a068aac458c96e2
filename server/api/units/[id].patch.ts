import { updateUnit } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import { UnitPatchSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, UnitPatchSchema)
  return (await updateUnit(actor, { unitId: id, patch })) satisfies UnitDto
})
