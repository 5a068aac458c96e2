import type { ServiceReport } from '#shared/types/reports'

/** The report model of a case. The type is named because a route with an id does not infer one. */
export function useServiceReport(caseId: number) {
  return useFetch<ServiceReport>(`/api/cases/${caseId}/report`, { key: `case-report-${caseId}` })
}
