import { setReportPhotos } from '#server/services/cases'
import { IdParamsSchema } from '#shared/schemas/common'
import { ReportPhotosSchema } from '#shared/schemas/reports'
import type { CaseDto } from '#shared/types/cases'

// The photos of the case to show in its report and PDF.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { uploadIds } = await readBodyAs(event, ReportPhotosSchema)
  return (await setReportPhotos(actor, { caseId: id, uploadIds }, new Date())) satisfies CaseDto
})
