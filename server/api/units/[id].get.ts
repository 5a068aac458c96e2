import { findUnit } from '#server/db/repositories/equipment'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const unit = await findUnit(user.organisationId, id)
  if (!unit) throw notFound('Unit')
  return unit
})
