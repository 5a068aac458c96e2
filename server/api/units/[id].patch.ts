import { findUnit, updateUnit } from '#server/db/repositories/equipment'
import { mergeUnitPatch } from '#server/domain/equipment/unit-patch'
import { IdParamsSchema } from '#shared/schemas/common'
import { UnitInputSchema, UnitPatchSchema } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:edit')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const patch = await readBodyAs(event, UnitPatchSchema)
  const saved = await findUnit(user.organisationId, id)
  if (!saved) throw notFound('Unit')
  // The merged unit must pass the same checks as a new one (kind against stages and so on).
  const input = parseAs(UnitInputSchema, mergeUnitPatch(saved, patch))
  await withDomainErrors(() => updateUnit(user.organisationId, id, input))
  forgetCachedUnit(user.organisationId, id)
  return (await findUnit(user.organisationId, id))! satisfies UnitDto
})
