import { serviceReport } from '#server/services/reports'
import { IdParamsSchema } from '#shared/schemas/common'
import type { ServiceReport } from '#shared/types/reports'

// The service report as data; the printable page, the PDF and the e-mail share this model.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await serviceReport(actor, { caseId: id })) satisfies ServiceReport
})
