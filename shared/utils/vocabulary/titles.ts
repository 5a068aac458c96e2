/**
 * Titles a knowledge base stores for its causes, tests and outcomes. Labels fall back to them for a
 * word the vocabulary has no entry for yet (a cause added to the knowledge base last week).
 */
export interface KnowledgeBaseTitles {
  causes: Readonly<Record<string, string>>
  tests: Readonly<Record<string, string>>
  /** Outcome labels per test: `outcomes[test][outcome]`. */
  outcomes: Readonly<Record<string, Readonly<Record<string, string>>>>
}

/** No titles known: labels come from the vocabulary alone. */
export const NO_TITLES: KnowledgeBaseTitles = { causes: {}, tests: {}, outcomes: {} }
