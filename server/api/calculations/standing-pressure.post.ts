import { StandingPressureBodySchema } from '#shared/schemas/properties'
import type { StandingDto } from '#shared/types/properties-dto'
import { resolveRefrigerant, standingCheck } from '#shared/utils/calculator'

// Pure computation: the calculator module is the service here.
export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const input = await readBodyAs(event, StandingPressureBodySchema)
  return standingCheck(resolveRefrigerant(input.designation), input) satisfies StandingDto
})
