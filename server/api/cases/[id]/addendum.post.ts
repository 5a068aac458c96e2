import { appendEvents } from '#server/db/repositories/cases'
import { NoteSchema } from '#shared/schemas/cases'
import { IdParamsSchema } from '#shared/schemas/common'

// A closed case stays read-only; an addendum is the one thing that may still be added to it.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const { text } = await readBodyAs(event, NoteSchema)
  const current = await caseOr404(user, id)
  if (current.status !== 'closed') {
    throw createError({ status: 409, statusText: 'Conflict', message: 'An addendum is for closed cases; add a note to an open case instead' })
  }
  await useDb().transaction((transaction) => appendEvents(id, user.id, [{ type: 'addendum', payload: { text } }], transaction))
  return caseOr404(user, id)
})
