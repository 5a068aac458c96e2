import { retryEmail } from '#server/services/reports'
import { IdParamsSchema } from '#shared/schemas/common'
import type { EmailDto } from '#shared/types/cases'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return (await retryEmail(actor, { emailId: id })) satisfies EmailDto
})
