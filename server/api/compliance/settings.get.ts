import { complianceSettings } from '#server/services/refrigerant-log'
import type { ComplianceSettingsDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  return (await complianceSettings(actor)) satisfies ComplianceSettingsDto
})
