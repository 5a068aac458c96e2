import { contentDisposition } from '#server/domain/files/content-disposition'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const found = await caseOr404(user, id)
  const pdf = await renderReportPdf(await serviceReportOf(found, user.organisationId))
  setResponseHeaders(event, {
    'content-type': 'application/pdf',
    'content-length': pdf.length,
    'content-disposition': contentDisposition('inline', reportPdfName(id)),
    'cache-control': 'private, no-store',
  })
  return pdf
})
