import type { CaseDto } from '#shared/types/cases'

/** The full record of a case. The type is named because a route with an id does not infer one. */
export function useCaseRecord(caseId: number) {
  return useFetch<CaseDto>(`/api/cases/${caseId}`, { key: `case-${caseId}` })
}
