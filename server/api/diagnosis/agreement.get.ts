import { rankingTrackRecord } from '#server/services/diagnosis'
import type { RankingAgreement } from '#shared/types/diagnosis'

// The knowledge base's track record on the organisation's closed cases.
export default defineApiHandler(async (event) => {
  const actor = await requireUser(event, 'knowledge:read')
  return (await rankingTrackRecord(actor)) satisfies RankingAgreement
})
