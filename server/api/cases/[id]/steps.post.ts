import { addRepairStep } from '#server/services/cases'
import { IdParamsSchema } from '#shared/schemas/common'
import { AddRepairStepSchema } from '#shared/schemas/repair-steps'
import type { CaseDto } from '#shared/types/cases'

// Records a repair or verification step (pressure hold, evacuation, hot work, recharge) with its verdict.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, AddRepairStepSchema)
  return (await addRepairStep(actor, { ...input, caseId: id }, new Date())) satisfies CaseDto
})
