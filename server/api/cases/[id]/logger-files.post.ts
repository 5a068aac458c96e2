import { assertCaseTakesFiles } from '#server/services/uploads'
import { addLoggerFile } from '#server/services/logger'
import { IdParamsSchema } from '#shared/schemas/common'
import { LoggerUploadQuerySchema } from '#shared/schemas/logger-files'
import type { LoggerFileDto } from '#shared/types/logger-files'

// The body is the CSV itself (text/csv, 64 MB at most); `?name=` gives its file name, `&loggerModel=` the logger.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const query = await readQueryAs(event, LoggerUploadQuerySchema)
  await assertCaseTakesFiles(actor, { caseId: id })
  const saved = await addLoggerFile(actor, { caseId: id, ...query, bytes: await readLoggerBody(event) })
  setResponseStatus(event, 201)
  return saved satisfies LoggerFileDto
})
