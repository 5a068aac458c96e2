import { unitRefrigerantLog } from '#server/services/refrigerant-log'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UnitRefrigerantLogDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await unitRefrigerantLog(actor, { unitId: id }, new Date())) satisfies UnitRefrigerantLogDto
})
