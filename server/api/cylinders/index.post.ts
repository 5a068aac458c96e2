import { createCylinder } from '#server/services/refrigerant-log'
import { CylinderSchema } from '#shared/schemas/refrigerant-log'
import type { CylinderDetailDto } from '#shared/types/refrigerant-log'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const input = await readBodyAs(event, CylinderSchema)
  const cylinder = await createCylinder(actor, input)
  setResponseStatus(event, 201)
  return cylinder satisfies CylinderDetailDto
})
