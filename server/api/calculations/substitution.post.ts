import { SubstitutionBodySchema } from '#shared/schemas/charging'
import type { SubstitutionDto } from '#shared/types/charging-dto'
import { substitutionPlan } from '#shared/utils/calculator'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const input = await readBodyAs(event, SubstitutionBodySchema)
  return substitutionPlan(input) satisfies SubstitutionDto
})
