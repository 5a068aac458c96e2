import { replayCase } from '#server/services/training'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CaseReplayDto } from '#shared/types/training'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'training:run')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await replayCase(actor, { caseId: id })) satisfies CaseReplayDto
})
