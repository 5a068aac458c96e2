import { signIn } from '#server/services/users'
import { LoginSchema } from '#shared/schemas/auth'
import type { UserDto } from '#shared/types/api'

export default defineApiHandler(async (event) => {
  const input = await readBodyAs(event, LoginSchema)
  const { organisationId, ...user } = await signIn(input)
  await setUserSession(event, { user: { ...user, organisationId }, loggedInAt: Date.now() })
  return { user: user satisfies UserDto }
})
