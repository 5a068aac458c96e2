import { sendServiceReport } from '#server/services/reports'
import { IdParamsSchema } from '#shared/schemas/common'
import { SendReportSchema } from '#shared/schemas/reports'
import type { ReportSendResult } from '#shared/types/reports'

// Queues the report e-mail; delivery (and its retries) runs as background jobs.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { to, recipients } = await readBodyAs(event, SendReportSchema)
  const sent = await sendServiceReport(actor, { caseId: id, to, recipients }, new Date())
  setResponseStatus(event, 202)
  return sent satisfies ReportSendResult
})
