export interface DiagnosticTestInfo {
  test: string
  title: string
  minutes: number
  opensSystem: boolean
  hotWork: boolean
  stages: string[]
  safetyNotes: string[]
  procedure: string
  outcomes: { outcome: string; label: string }[]
}

/** The published tests with procedures and outcome words, fetched once per page. */
export function useDiagnosticTests() {
  const { data } = useFetch<DiagnosticTestInfo[]>('/api/diagnosis/tests', { key: 'diagnostic-tests', default: () => [] })
  const byTest = computed(() => new Map(data.value.map((t) => [t.test, t])))
  return { tests: data, byTest }
}
