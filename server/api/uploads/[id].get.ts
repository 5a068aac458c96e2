import { IdParamsSchema } from '#shared/schemas/common'
import { UploadFileQuerySchema } from '#shared/schemas/uploads'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, ['cases:read', 'equipment:read'])
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { thumb, download } = await readQueryAs(event, UploadFileQuerySchema)
  const file = await uploadFileOr404(user, id, thumb)
  setResponseHeaders(event, uploadHeaders(file, download))
  return file.bytes
})
