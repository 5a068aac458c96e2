import { rankForActor } from '#server/services/diagnosis'
import { rankRequestSchema } from '#shared/schemas/diagnosis'
import type { RankRequest, RankResponse } from '#shared/types/diagnosis'

// Ranks causes for a described unit and what was observed; saves nothing.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:read')
  const request = (await readBodyAs(event, rankRequestSchema)) as RankRequest
  return (await rankForActor(actor, request)) satisfies RankResponse
})
