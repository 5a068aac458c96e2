import { insertCase, saveCase } from '#server/db/repositories/cases'
import { findUnit } from '#server/db/repositories/equipment'
import { rankingEvents, rankRequestFor } from '#server/domain/cases/case-record'
import { NewCaseSchema } from '#shared/schemas/cases'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const input = await readBodyAs(event, NewCaseSchema)
  const unit = await findUnit(user.organisationId, input.unitId)
  if (!unit) throw notFound('Unit')
  const ranking = await rankForOrganisation(user.organisationId, rankRequestFor(unit, { symptoms: input.symptoms, readings: [], testResults: [] }), unit.equipmentClass)
  const id = await useDb().transaction(async (transaction) => {
    const caseId = await insertCase(
      { organisationId: user.organisationId, unitId: unit.id, technicianId: user.id, complaint: input.complaint, symptoms: input.symptoms },
      [
        { type: 'case-opened', payload: { complaint: input.complaint, unitId: unit.id } },
        ...(input.symptoms.length ? [{ type: 'symptoms-set', payload: { symptoms: input.symptoms } }] : []),
        ...rankingEvents(null, ranking),
      ],
      transaction,
    )
    await saveCase(caseId, { ranking }, transaction)
    return caseId
  })
  setResponseStatus(event, 201)
  return caseOr404(user, id)
})
