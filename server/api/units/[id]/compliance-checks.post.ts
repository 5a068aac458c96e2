import { addComplianceCheck } from '#server/services/refrigerant-log'
import { IdParamsSchema } from '#shared/schemas/common'
import { ComplianceCheckSchema } from '#shared/schemas/refrigerant-log'
import type { UnitRefrigerantLogDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const check = await readBodyAs(event, ComplianceCheckSchema)
  const log = await addComplianceCheck(actor, { unitId: id, check }, new Date())
  setResponseStatus(event, 201)
  return log satisfies UnitRefrigerantLogDto
})
