import { correctReading } from '#server/services/cases'
import { CaseEntryParamsSchema, ReadingCorrectionSchema } from '#shared/schemas/cases'
import type { CaseDto } from '#shared/types/cases'

// Strikes out or corrects one reading with a reason; the timeline keeps the correction as its own event.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id, index } = await readParamsAs(event, CaseEntryParamsSchema)
  const input = await readBodyAs(event, ReadingCorrectionSchema)
  return (await correctReading(actor, { ...input, caseId: id, index }, new Date())) satisfies CaseDto
})
