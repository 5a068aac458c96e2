import type { KnowledgeBaseTitles } from '#shared/utils/vocabulary'

/** The published knowledge base's titles for causes, tests and outcomes, for words the vocabulary has no entry for. */
export function useKnowledgeBaseTitles() {
  const { data } = useFetch<KnowledgeBaseTitles>('/api/diagnosis/titles', {
    key: 'knowledge-base-titles',
    default: () => ({ causes: {}, tests: {}, outcomes: {} }),
  })
  return data
}
