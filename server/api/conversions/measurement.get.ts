import { MeasurementConversionQuerySchema } from '#shared/schemas/properties'
import type { MeasurementConversionDto } from '#shared/types/properties-dto'
import { convertReading } from '#shared/utils/calculator'

// A value from one measurement unit to another (?value=15&from=psig&to=kPa); gauge units use the site's atmosphere.
export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const query = await readQueryAs(event, MeasurementConversionQuerySchema)
  return convertReading(query) satisfies MeasurementConversionDto
})
