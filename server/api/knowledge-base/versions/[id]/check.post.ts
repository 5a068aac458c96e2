import { checkVersion } from '#server/services/knowledge-drafts'
import { IdParamsSchema } from '#shared/schemas/common'
import type { VersionCheckDto } from '#shared/types/knowledge'

// Runs the version's worked examples and the scenario suite against it and lists the failures.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:author')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await checkVersion(actor, { versionId: id })) satisfies VersionCheckDto
})
