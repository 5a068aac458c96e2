import { listCases, unitTransactions } from '#server/db/repositories/cases'
import { findUnit, unitUploads } from '#server/db/repositories/equipment'
import { refrigerantSafety } from '#server/domain/equipment/refrigerant-safety'
import { IdParamsSchema } from '#shared/schemas/common'
import type { UnitOverviewDto } from '#shared/types/equipment-dto'

const PAST_CASES_SHOWN = 20

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'equipment:read')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const unit = await findUnit(user.organisationId, id)
  if (!unit) throw notFound('Unit')
  const base = { unitId: id, sort: 'opened', direction: 'desc', page: 1 } as const
  const [open, past, transactions, uploads] = await Promise.all([
    listCases(user.organisationId, { ...base, status: 'open', pageSize: 100 }),
    listCases(user.organisationId, { ...base, status: 'closed', pageSize: PAST_CASES_SHOWN }),
    unitTransactions(user.organisationId, id),
    unitUploads(user.organisationId, id),
  ])
  return {
    unit,
    refrigerants: refrigerantSafety(unit.stages.map((s) => s.refrigerant)),
    openCases: open.items,
    pastCases: past.items,
    pastCaseTotal: past.total,
    transactions,
    uploads,
    nameplate: uploads.find((u) => u.purpose === 'nameplate') ?? null,
  } satisfies UnitOverviewDto
})
