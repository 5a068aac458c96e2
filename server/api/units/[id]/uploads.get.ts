import { unitFiles } from '#server/services/equipment'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UploadDto } from '#shared/types/uploads'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await unitFiles(actor, { unitId: id })) satisfies UploadDto[]
})
