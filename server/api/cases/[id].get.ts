import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  return caseOr404(user, id)
})
