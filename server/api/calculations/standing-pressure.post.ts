import { StandingPressureBodySchema } from '#shared/schemas/properties'
import type { StandingDto } from '#shared/types/properties-dto'
import { resolveRefrigerant, standingCheck } from '#shared/utils/calculator'

export default defineEventHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const input = await readBodyAs(event, StandingPressureBodySchema)
  return withDomainErrors(() => standingCheck(resolveRefrigerant(input.designation), input) satisfies StandingDto)
})
