import { findUnit } from '#server/db/repositories/equipment'
import { unitUploads } from '#server/db/repositories/uploads'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  if (!(await findUnit(user.organisationId, id))) throw notFound('Unit')
  return unitUploads(user.organisationId, id)
})
