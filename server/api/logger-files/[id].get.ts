import { getLoggerFile } from '#server/services/logger'
import { IdParamsSchema } from '#shared/schemas/common'
import type { LoggerFileDto } from '#shared/types/logger-files'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getLoggerFile(actor, { loggerFileId: id })) satisfies LoggerFileDto
})
