import { processLoggerFile } from '#server/services/logger'
import { IdParamsSchema } from '#shared/schemas/common'
import { LoggerProcessSchema } from '#shared/schemas/logger-files'
import type { LoggerJobDto } from '#shared/types/logger-files'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, LoggerProcessSchema)
  const queued = await processLoggerFile(actor, { loggerFileId: id, ...input })
  setResponseStatus(event, 202)
  return queued satisfies LoggerJobDto
})
