import { findUnit } from '#server/db/repositories/equipment'
import { IdParamsSchema } from '#shared/schemas/common'

// A file about the unit itself (nameplate, certificate), not tied to one case.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, ['equipment:edit', 'cases:work'])
  const { id } = await readParamsAs(event, IdParamsSchema)
  if (!(await findUnit(user.organisationId, id))) throw notFound('Unit')
  const form = await readUploadForm(event)
  const saved = await saveUpload(user, { unitId: id }, form)
  setResponseStatus(event, 201)
  return saved
})
