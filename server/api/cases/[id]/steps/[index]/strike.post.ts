import { strikeRepairStep } from '#server/services/cases'
import { CaseEntryParamsSchema, StrikeSchema } from '#shared/schemas/cases'
import type { CaseDto } from '#shared/types/cases'

// Strikes out a step recorded by mistake, with a reason.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id, index } = await readParamsAs(event, CaseEntryParamsSchema)
  const input = await readBodyAs(event, StrikeSchema)
  return (await strikeRepairStep(actor, { ...input, caseId: id, index }, new Date())) satisfies CaseDto
})
