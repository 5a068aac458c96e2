import { unitOverview } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UnitOverviewDto } from '#shared/types/unit-overview'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await unitOverview(actor, { unitId: id })) satisfies UnitOverviewDto
})
