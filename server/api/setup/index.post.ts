import { completeFirstAdminSetup } from '#server/services/first-admin'
import { FirstAdminSchema } from '#shared/schemas/setup'

export default defineApiHandler(async (event) => {
  const input = await readBodyAs(event, FirstAdminSchema)
  setResponseStatus(event, 201)
  return completeFirstAdminSetup(input, new Date())
})
