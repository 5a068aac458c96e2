import { IdParamsSchema } from '#shared/schemas/common'
import { SendReportSchema } from '#shared/schemas/reports'
import type { ReportSendResult } from '#shared/types/reports'

// Queues the report e-mail; delivery (and its retries) runs in the background.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { to } = await readBodyAs(event, SendReportSchema)
  const found = await caseOr404(user, id)
  const queued = await queueServiceReport(user, found, to ? [to] : undefined)
  if (!queued.length) {
    throw createError({ status: 422, statusText: 'Unprocessable Entity', message: 'No one at this site receives reports. Enter an e-mail address to send it to.' })
  }
  setResponseStatus(event, 202)
  return { queued: queued.length, emails: (await caseOr404(user, id)).emails } satisfies ReportSendResult
})
