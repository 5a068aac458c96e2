import { addCaseFile, assertCaseTakesFiles } from '#server/services/uploads'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UploadDto } from '#shared/types/uploads'

// Multipart: `file` (JPEG, PNG, WebP or PDF by content, 25 MB at most) and optional `purpose`.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  await assertCaseTakesFiles(actor, { caseId: id })
  const saved = await addCaseFile(actor, { caseId: id, file: await readUploadForm(event) }, new Date())
  setResponseStatus(event, 201)
  return saved satisfies UploadDto
})
