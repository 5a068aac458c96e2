import { unitRegister } from '#server/services/equipment'
import { UnitRegisterQuerySchema } from '#shared/schemas/equipment'
import type { Page, UnitDto } from '#shared/types/equipment-dto'

// The paginated register lives here because `GET /api/units` must keep returning a plain array.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const query = await readQueryAs(event, UnitRegisterQuerySchema)
  return (await unitRegister(actor, query)) satisfies Page<UnitDto>
})
