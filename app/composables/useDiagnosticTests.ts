import type { DiagnosticTestDto } from '#shared/types/diagnosis-catalogue'

/** The published tests with procedures and outcome words, fetched once per page. */
export function useDiagnosticTests() {
  const { data } = useFetch<DiagnosticTestDto[]>('/api/diagnosis/tests', { key: 'diagnostic-tests', default: () => [] })
  const byTest = computed(() => new Map(data.value.map((t) => [t.test, t])))
  return { tests: data, byTest }
}
