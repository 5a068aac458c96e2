import { setupLinkState } from '#server/services/first-admin'
import { SetupLinkQuerySchema } from '#shared/schemas/setup'

export default defineApiHandler(async (event) => {
  const { token } = await readQueryAs(event, SetupLinkQuerySchema)
  return setupLinkState(token, new Date())
})
