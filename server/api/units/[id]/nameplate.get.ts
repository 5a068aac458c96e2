import { unitNameplateHistory } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import type { NameplateRecordDto } from '#shared/types/equipment-dto'

// The unit's nameplate history: every refill of a stage, newest first.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await unitNameplateHistory(actor, { unitId: id })) satisfies NameplateRecordDto[]
})
