import { IdParamsSchema } from '#shared/schemas/common'

// The service report as data; the printable page, the PDF and the e-mail share this model.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const found = await caseOr404(user, id)
  return serviceReportOf(found, user.organisationId)
})
