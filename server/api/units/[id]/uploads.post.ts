import { addUnitFile, assertUnitTakesFiles } from '#server/services/uploads'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UploadDto } from '#shared/types/uploads'

// A file about the unit itself (nameplate, certificate), not tied to one case.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, ['equipment:edit', 'cases:work'])
  const { id } = await readParamsAs(event, IdParamsSchema)
  await assertUnitTakesFiles(actor, { unitId: id })
  const saved = await addUnitFile(actor, { unitId: id, file: await readUploadForm(event) }, new Date())
  setResponseStatus(event, 201)
  return saved satisfies UploadDto
})
