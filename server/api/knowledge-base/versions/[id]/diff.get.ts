import { versionDiff } from '#server/services/knowledge-drafts'
import { IdParamsSchema } from '#shared/schemas/common'
import { z } from 'zod'

const QuerySchema = z.object({ against: z.coerce.number().int().positive().optional() })

// What a version changes against the one it was copied from (or the published one, or `against`).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { against } = await readQueryAs(event, QuerySchema)
  return versionDiff(actor, { versionId: id, against })
})
