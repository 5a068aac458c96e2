import { getCylinder } from '#server/services/refrigerant-log'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CylinderDetailDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getCylinder(actor, { cylinderId: id })) satisfies CylinderDetailDto
})
