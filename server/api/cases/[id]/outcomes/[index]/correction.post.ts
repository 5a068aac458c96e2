import { correctOutcome } from '#server/services/cases'
import { CaseEntryParamsSchema, OutcomeCorrectionSchema } from '#shared/schemas/cases'
import type { CaseDto } from '#shared/types/cases'

// Strikes out or corrects one test outcome with a reason; the timeline keeps the correction as its own event.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id, index } = await readParamsAs(event, CaseEntryParamsSchema)
  const input = await readBodyAs(event, OutcomeCorrectionSchema)
  return (await correctOutcome(actor, { ...input, caseId: id, index }, new Date())) satisfies CaseDto
})
