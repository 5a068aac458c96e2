import { setUnitComplianceSettings } from '#server/services/refrigerant-log'
import { IdParamsSchema } from '#shared/schemas/common'
import { UnitComplianceSettingsSchema } from '#shared/schemas/refrigerant-log'
import type { UnitRefrigerantLogDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const settings = await readBodyAs(event, UnitComplianceSettingsSchema)
  return (await setUnitComplianceSettings(actor, { unitId: id, settings }, new Date())) satisfies UnitRefrigerantLogDto
})
