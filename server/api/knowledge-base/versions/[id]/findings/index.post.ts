import { addFinding } from '#server/services/knowledge-drafts'
import { findingCreateSchema } from '#server/domain/knowledge/inputs'
import { IdParamsSchema } from '#shared/schemas/common'

// Adds a finding (with its examples) to a draft.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const input = await readBodyAs(event, findingCreateSchema)
  const created = await addFinding(actor, { ...input, versionId: id }, new Date())
  setResponseStatus(event, 201)
  return created
})
