import { DesignationParamsSchema, SaturationQuerySchema } from '#shared/schemas/properties'
import type { SaturationDto } from '#shared/types/properties-dto'
import { resolveRefrigerant, saturationLookup } from '#shared/utils/calculator'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const { designation } = await readParamsAs(event, DesignationParamsSchema)
  const query = await readQueryAs(event, SaturationQuerySchema)
  return saturationLookup(resolveRefrigerant(designation), query) satisfies SaturationDto
})
