import { checkStages } from '#server/domain/cases/case-record'
import { AddTestResultSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { version, note, ...result } = await readBodyAs(event, AddTestResultSchema)
  return changeCase(event, user, id, version, (current, unit) => {
    const problems = checkStages(unit, [result], 'testResult')
    if (problems.length) throw createError({ status: 400, statusText: 'Bad Request', message: problems[0], data: { fieldErrors: { stage: problems } } })
    const recorded = { ...result, at: new Date().toISOString(), by: user.id }
    return {
      changes: { testResults: [...current.testResults, recorded] },
      events: [{ type: 'outcome-recorded', payload: { test: result.test, stage: result.stage, outcome: result.outcome, note } }],
      rerank: true,
    }
  })
})
