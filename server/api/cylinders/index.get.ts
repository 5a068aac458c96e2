import { listCylinders } from '#server/services/refrigerant-log'
import type { CylinderDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  return (await listCylinders(actor)) satisfies CylinderDto[]
})
