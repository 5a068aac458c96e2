import { addAddendum } from '#server/services/cases'
import { NoteSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'
import type { CaseDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, NoteSchema)
  return (await addAddendum(actor, { ...input, caseId: id }, new Date())) satisfies CaseDto
})
