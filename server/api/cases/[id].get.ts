import { getCase } from '#server/services/cases'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CaseDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await getCase(actor, { caseId: id })) satisfies CaseDto
})
