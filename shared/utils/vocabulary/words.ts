// The shape every entry of the vocabulary shares, and the last-resort wording for a word that has
// no entry yet. Machine words stay the API's words; these modules say what a person reads instead.

/** How a word is shown: `short` where space is tight (badges, table cells), `long` everywhere else. */
export interface WordLabel {
  short: string
  long: string
}

/** Which of the two forms to show. */
export type WordForm = keyof WordLabel

/** Optional labels of an entry: a word may be listed before anyone wrote its label. */
export type WordEntry = Partial<WordLabel>

/**
 * A readable phrase for a word nobody labelled ("expansion-valve-underfeeding" → "Expansion valve
 * underfeeding", "cabinetTemperature" → "Cabinet temperature"), so no raw slug reaches a person.
 */
export function humanise(word: string): string {
  const spaced = word
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[-_.]+/g, ' ')
    .trim()
    .toLowerCase()
  return spaced ? spaced[0]!.toUpperCase() + spaced.slice(1) : word
}

/** The label of `word` in `form`: the entry's own, else a stored title (the knowledge base's), else a readable phrase. */
export function labelOf(entry: WordEntry | undefined, word: string, form: WordForm, fallbackTitle?: string | null): string {
  const own = entry?.[form] ?? entry?.long ?? entry?.short
  return own ?? (fallbackTitle?.trim() || humanise(word))
}
