import { Co2eBodySchema } from '#shared/schemas/compliance'
import type { Co2eDto } from '#shared/types/compliance'
import { co2eOfCharge } from '#server/domain/compliance/f-gas'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  const input = await readBodyAs(event, Co2eBodySchema)
  return co2eOfCharge(input) satisfies Co2eDto
})
