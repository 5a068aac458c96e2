import { openCase } from '#server/services/cases'
import { NewCaseSchema } from '#shared/schemas/cases'
import type { CaseDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const input = await readBodyAs(event, NewCaseSchema)
  const opened = await openCase(actor, input, new Date())
  setResponseStatus(event, 201)
  return opened satisfies CaseDto
})
