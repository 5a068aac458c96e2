import { refillStage } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import { NameplateRefillSchema } from '#shared/schemas/equipment'

// A stage refilled with another refrigerant or charge: the stage takes it, the history keeps the change.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, NameplateRefillSchema)
  setResponseStatus(event, 201)
  return refillStage(actor, { ...input, unitId: id }, new Date())
})
