import { listUnitRegister } from '#server/db/repositories/equipment'
import { UnitRegisterQuerySchema } from '#shared/schemas/equipment'
import type { Page, UnitDto } from '#shared/types/equipment-dto'

// The paginated register lives here because `GET /api/units` must keep returning a plain array.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const query = await readQueryAs(event, UnitRegisterQuerySchema)
  const { items, total } = await listUnitRegister(user.organisationId, query)
  return { items, total, page: query.page, pageSize: query.pageSize } satisfies Page<UnitDto>
})
