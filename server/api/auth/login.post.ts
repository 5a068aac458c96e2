import { signIn } from '#server/services/users'
import { LoginSchema } from '#shared/schemas/auth'
import type { UserDto } from '#shared/types/api'

export default defineApiHandler(async (event) => {
  const input = await readBodyAs(event, LoginSchema)
  const client = { address: getRequestIP(event) ?? 'unknown', userAgent: getRequestHeader(event, 'user-agent') ?? '', lifetimeS: sessionLifetimeS() }
  const { user: { organisationId, ...user }, sessionId } = await signIn(input, new Date(), client)
  await setUserSession(event, { user: { ...user, organisationId }, sid: sessionId, loggedInAt: Date.now() })
  return { user: user satisfies UserDto }
})
