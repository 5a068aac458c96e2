import { recordTestResult } from '#server/services/cases'
import { AddTestResultSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CaseDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, AddTestResultSchema)
  return (await recordTestResult(actor, { ...input, caseId: id }, new Date())) satisfies CaseDto
})
