import { exportBundle } from '#server/services/knowledge'
import type { KnowledgeBaseBundle } from '#server/domain/knowledge/bundle'
import { IdParamsSchema } from '#shared/schemas/common'

// The whole version, with its findings' examples, as one bundle (docs/knowledge-base-bundle.md).
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await exportBundle(actor, { versionId: id }, new Date())) satisfies KnowledgeBaseBundle
})
