const FIGURES = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 })

/** A value with its unit, joined by a no-break space so they never wrap apart; "—" when unknown. */
export function quantityText(value: number | null | undefined, unit: string): string {
  if (value === null || value === undefined) return '—'
  return `${FIGURES.format(value).replace('-', '\u2212')}\u00a0${unit}`
}

/** A date (and time) in the technician's locale, for logs and case lists. */
export function dateText(iso: string, withTime = false): string {
  const d = new Date(iso)
  return withTime ? d.toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' }) : d.toLocaleDateString('en-GB', { dateStyle: 'medium' })
}

/** "1 site", "3 sites": a count with its noun in the right number. */
export function countText(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${n === 1 ? singular : plural}`
}
