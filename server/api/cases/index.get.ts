import { listCases } from '#server/services/cases'
import { CaseListQuerySchema } from '#shared/schemas/cases'
import type { CaseListItem } from '#shared/types/cases'
import type { Page } from '#shared/types/equipment-dto'

export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'cases:read')
  const query = await readQueryAs(event, CaseListQuerySchema)
  return (await listCases(actor, query)) satisfies Page<CaseListItem>
})
