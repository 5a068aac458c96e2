import { checkStages } from '#server/domain/cases/case-record'
import { AddReadingsSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { readings, version } = await readBodyAs(event, AddReadingsSchema)
  return changeCase(event, user, id, version, (current, unit) => {
    const problems = checkStages(unit, readings, 'readings')
    if (problems.length) throw createError({ status: 400, statusText: 'Bad Request', message: problems[0], data: { fieldErrors: { readings: problems } } })
    const at = new Date().toISOString()
    const added = readings.map((r) => ({ ...r, at, by: user.id }))
    return {
      changes: { readings: [...current.readings, ...added] },
      events: added.map((r) => ({ type: 'reading-entered', payload: { quantity: r.quantity, stage: r.stage, value: r.value, unit: r.unit } })),
      rerank: true,
    }
  })
})
