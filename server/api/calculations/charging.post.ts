import { ChargingBodySchema } from '#shared/schemas/charging'
import type { ChargingDto } from '#shared/types/charging-dto'
import { chargingCheck } from '#shared/utils/calculator'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const input = await readBodyAs(event, ChargingBodySchema)
  return chargingCheck(input) satisfies ChargingDto
})
