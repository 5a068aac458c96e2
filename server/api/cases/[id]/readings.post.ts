import { addReadings } from '#server/services/cases'
import { AddReadingsSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CaseDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, AddReadingsSchema)
  return (await addReadings(actor, { ...input, caseId: id }, new Date())) satisfies CaseDto
})
