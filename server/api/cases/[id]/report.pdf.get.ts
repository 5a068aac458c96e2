import { serviceReportPdf } from '#server/services/reports'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const pdf = await serviceReportPdf(actor, { caseId: id })
  setResponseHeaders(event, fileHeaders(pdf, { download: false, cache: 'private, no-store' }))
  return pdf.bytes
})
