import { LeakRateBodySchema } from '#shared/schemas/compliance'
import type { LeakRateDto } from '#shared/types/compliance'
import { leakRateCalculation } from '#server/domain/compliance/leak-rate'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const input = await readBodyAs(event, LeakRateBodySchema)
  return leakRateCalculation(input, new Date()) satisfies LeakRateDto
})
