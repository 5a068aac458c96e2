import { NoteSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { text, version } = await readBodyAs(event, NoteSchema)
  return changeCase(event, user, id, version, (current) => ({
    changes: { notes: current.notes ? `${current.notes}\n\n${text}` : text },
    events: [{ type: 'note', payload: { text } }],
  }))
})
