import { addLogLine } from '#server/services/refrigerant-log'
import { IdParamsSchema } from '#shared/schemas/common'
import { LogLineSchema } from '#shared/schemas/refrigerant-log'
import type { UnitRefrigerantLogDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const line = await readBodyAs(event, LogLineSchema)
  const log = await addLogLine(actor, { unitId: id, line }, new Date())
  setResponseStatus(event, 201)
  return log satisfies UnitRefrigerantLogDto
})
