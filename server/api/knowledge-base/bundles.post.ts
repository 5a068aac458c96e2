import { importBundle } from '#server/services/knowledge'
import { knowledgeBaseBundleSchema } from '#server/domain/knowledge/bundle'
import type { ImportedBundleDto } from '#shared/types/knowledge'

// Stores a bundle as a new draft; a malformed one is refused whole with field errors.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const bundle = await readBodyAs(event, knowledgeBaseBundleSchema)
  const created = await importBundle(actor, bundle, new Date())
  setResponseStatus(event, 201)
  return created satisfies ImportedBundleDto
})
