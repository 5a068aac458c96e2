import { changeOwnPassword } from '#server/services/users'
import { PasswordChangeSchema } from '#shared/schemas/auth'

// The signed-in person's new password; their sessions on other devices end.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event)
  const input = await readBodyAs(event, PasswordChangeSchema)
  await changeOwnPassword(actor, input, (await getUserSession(event)).sid!, new Date())
  setResponseStatus(event, 204)
  return null
})
