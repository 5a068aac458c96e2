import { acceptLoggerFindings } from '#server/services/logger'
import { IdParamsSchema } from '#shared/schemas/common'
import { LoggerAcceptSchema } from '#shared/schemas/logger-files'
import type { CaseDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, LoggerAcceptSchema)
  return (await acceptLoggerFindings(actor, { loggerFileId: id, ...input }, new Date())) satisfies CaseDto
})
