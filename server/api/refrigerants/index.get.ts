import type { RefrigerantDto } from '#shared/types/properties-dto'
import { listRefrigerants } from '#shared/utils/properties'

export default defineApiHandler(async (event) => {
  await requireUser(event, 'calculator:use')
  return listRefrigerants() satisfies RefrigerantDto[]
})
