import { findEmail, makeEmailDue } from '#server/db/repositories/emails'
import { IdParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'cases:work')
  const { id } = await readParamsAs(event, IdParamsSchema)
  const before = await makeEmailDue(user.organisationId, id)
  if (!before) throw notFound('E-mail')
  if (before === 'sent') {
    throw createError({ status: 409, statusText: 'Conflict', message: 'This e-mail was already sent. Use "Send" on the report to send it again.' })
  }
  await deliverDueEmails()
  return (await findEmail(user.organisationId, id))!
})
