import { insertTransactions } from '#server/db/repositories/cases'
import { planClose } from '#server/domain/cases/case-record'
import { CloseCaseSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { version, ...input } = await readBodyAs(event, CloseCaseSchema)
  const closed = await changeCase(event, user, id, version, async (_current, unit, transaction) => {
    const closure = planClose(unit, input, user.id)
    await insertTransactions(
      { organisationId: user.organisationId, caseId: id, unitId: unit.id, byUserId: user.id },
      closure.refrigerantTransactions,
      transaction!,
    )
    return {
      changes: { status: 'closed', closure, confirmedCauses: closure.confirmedCauses, closedAt: new Date() },
      events: [{ type: 'case-closed', payload: { ...closure } }],
    }
  }, { locked: true })
  invalidateDiagnosisCache(user.organisationId)
  await queueServiceReport(user, closed)
  return caseOr404(user, id)
})
