import { closedCaseRankings } from '#server/db/repositories/cases'
import { rankingAgreement } from '#server/domain/diagnosis/agreement'

// The knowledge base's track record on the organisation's closed cases.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event, 'knowledge:read')
  return rankingAgreement(await closedCaseRankings(user.organisationId))
})
