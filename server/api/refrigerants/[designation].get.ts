import { DesignationParamsSchema } from '#shared/schemas/properties'
import type { RefrigerantDto } from '#shared/types/properties-dto'
import { resolveRefrigerant } from '#shared/utils/calculator'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const { designation } = await readParamsAs(event, DesignationParamsSchema)
  return resolveRefrigerant(designation) satisfies RefrigerantDto
})
