import { getUnit } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UnitDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getUnit(actor, { unitId: id })) satisfies UnitDto
})
