import { setComplianceSettings } from '#server/services/refrigerant-log'
import { ComplianceSettingsSchema } from '#shared/schemas/refrigerant-log'
import type { ComplianceSettingsDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'compliance:configure')
  const input = await readBodyAs(event, ComplianceSettingsSchema)
  return (await setComplianceSettings(actor, input)) satisfies ComplianceSettingsDto
})
