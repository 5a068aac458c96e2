import { listUnits } from '#server/services/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  return (await listUnits(actor)) satisfies UnitDto[]
})
