// Statistics over an organisation's closed cases: how often each cause was confirmed (the learned
// priors of the diagnosis) and how the ranking shown at closing compared with what was confirmed.
import { QueryTypes } from 'sequelize'
import { ServiceCase } from '../models'

/** How often each cause was confirmed on the organisation's closed cases of units of one class (or kind). */
export async function confirmedCauseCounts(organisationId: number, group: { equipmentClass: string } | { kind: string }) {
  const [column, value] = 'equipmentClass' in group ? ['equipment_class', group.equipmentClass] : ['kind', group.kind]
  // A cause confirmed on judgement alone is not definitive; one settled by a test or by the repair
  // that cured it is, as are confirmations recorded before the basis was asked.
  return ServiceCase.sequelize!.query<{ cause: string; stage: string | null; count: number; definitive: boolean }>(
    `SELECT elem->>'cause' AS cause, elem->>'stage' AS stage, count(*)::int AS count, coalesce(elem->>'basis', '') <> 'judgement' AS definitive
       FROM cases c JOIN units u ON u.id = c.unit_id, jsonb_array_elements(c.confirmed_causes) elem
      WHERE c.organisation_id = :organisationId AND c.status = 'closed' AND u.${column} = :value
      GROUP BY 1, 2, 4`,
    { replacements: { organisationId, value }, type: QueryTypes.SELECT },
  )
}

/** Confirmed causes and the top of the last ranking of the organisation's latest closed cases. */
export async function closedCaseRankings(organisationId: number, limit = 500) {
  const rows = await ServiceCase.sequelize!.query<{ confirmed: { cause: string; stage?: string }[]; ranked: { cause: string; stage?: string }[] | null }>(
    `SELECT confirmed_causes AS confirmed, jsonb_path_query_array(ranking, '$.causes[0 to 2]') AS ranked
       FROM cases WHERE organisation_id = :organisationId AND status = 'closed' AND ranking IS NOT NULL
      ORDER BY closed_at DESC LIMIT :limit`,
    { replacements: { organisationId, limit }, type: QueryTypes.SELECT },
  )
  return rows.map((r) => ({ confirmed: r.confirmed, ranked: r.ranked ?? [] }))
}
