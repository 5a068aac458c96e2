import { rankRequestSchema } from '#shared/schemas/diagnosis'
import type { RankRequest } from '#shared/types/diagnosis'

// Ranks causes for a described unit and what was observed; saves nothing.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'knowledge:read')
  const request = (await readBodyAs(event, rankRequestSchema)) as RankRequest
  return rankForOrganisation(user.organisationId, request)
})
