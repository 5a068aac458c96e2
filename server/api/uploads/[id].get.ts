import { uploadFile } from '#server/services/uploads'
import { IdParamsSchema } from '#shared/schemas/common'
import { UploadFileQuerySchema } from '#shared/schemas/uploads'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, ['cases:read', 'equipment:read'])
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { thumb, download } = await readQueryAs(event, UploadFileQuerySchema)
  const file = await uploadFile(actor, { uploadId: id, thumb })
  setResponseHeaders(event, fileHeaders(file, { download }))
  return file.bytes
})
