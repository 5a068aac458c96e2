import { rememberedMapping } from '#server/services/logger'
import { LoggerMappingQuerySchema } from '#shared/schemas/logger-files'
import type { LoggerMappingDto } from '#shared/types/logger-files'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const query = await readQueryAs(event, LoggerMappingQuerySchema)
  return (await rememberedMapping(actor, query)) satisfies LoggerMappingDto
})
