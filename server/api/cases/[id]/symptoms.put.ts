import { SetSymptomsSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { symptoms, version } = await readBodyAs(event, SetSymptomsSchema)
  return changeCase(event, user, id, version, () => ({
    changes: { symptoms: [...new Set(symptoms)] },
    events: [{ type: 'symptoms-set', payload: { symptoms } }],
    rerank: true,
  }))
})
