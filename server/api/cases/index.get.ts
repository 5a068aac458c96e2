import { listCases } from '#server/db/repositories/cases'
import { CaseListQuerySchema } from '#shared/schemas/cases'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:read')
  const filters = await readQueryAs(event, CaseListQuerySchema)
  const { items, total } = await listCases(user.organisationId, filters)
  return { items, total, page: filters.page, pageSize: filters.pageSize }
})
