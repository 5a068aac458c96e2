import { UnitsConversionQuerySchema } from '#shared/schemas/properties'
import type { UnitsConversionDto } from '#shared/types/properties-dto'
import { convertReading } from '#shared/utils/calculator'

// Not under /api/units: that path belongs to the equipment register.
export default defineEventHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const query = await readQueryAs(event, UnitsConversionQuerySchema)
  return withDomainErrors(() => convertReading(query) satisfies UnitsConversionDto)
})
