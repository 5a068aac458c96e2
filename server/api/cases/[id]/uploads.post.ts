import { assertCaseTakesUploads } from '#server/domain/uploads/upload-rules'
import { IdParamsSchema } from '#shared/schemas/common'

// Multipart: `file` (JPEG, PNG, WebP or PDF by content, 10 MB at most) and optional `purpose`.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  // Refuse a foreign or closed case before taking the bytes in.
  const current = await caseOr404(user, id)
  await withDomainErrors(() => assertCaseTakesUploads(current.status))
  const form = await readUploadForm(event)
  const saved = await saveUpload(user, { caseId: id }, form)
  setResponseStatus(event, 201)
  return saved
})
