// The structured condition editor shows a condition's value as text and reads it back by operator
// and fact type; pure, so both directions are unit-tested without a page.

export type EditedValue = number | string | boolean | number[] | string[]
export type FactType = 'number' | 'boolean' | 'string'

const PAIR_OPERATORS = ['between', 'outside', 'withinPercent', 'outsidePercent']
const LIST_OPERATORS = ['in', 'notIn']

/** A value as the editor's text box shows it. */
export function formatConditionValue(value: unknown): string {
  if (Array.isArray(value)) return value.join(', ')
  if (value === undefined || value === null) return ''
  return String(value)
}

function scalar(text: string, type: FactType | undefined): number | string | boolean {
  const t = text.trim()
  if (type === 'boolean' || t === 'true' || t === 'false') return t === 'true'
  if (type !== 'string' && t !== '' && Number.isFinite(Number(t))) return Number(t)
  return t
}

/** Reads the text box back into a value of the shape the operator needs (a pair, a list or one value). */
export function parseConditionValue(text: string, operator: string, type: FactType | undefined): EditedValue {
  if (PAIR_OPERATORS.includes(operator) || LIST_OPERATORS.includes(operator)) {
    const parts = text.split(',').map((p) => p.trim()).filter((p) => p !== '')
    const numbers = parts.map(Number)
    if (PAIR_OPERATORS.includes(operator) || numbers.every((n) => Number.isFinite(n))) return numbers
    return parts
  }
  return scalar(text, type)
}

/** Fact names an author picks from: every concrete name, and `{stage}.x` for the per-stage ones. */
export function factChoices(names: string[]): string[] {
  const staged = new Set<string>()
  for (const n of names) {
    const m = /^(high|low|single)\.(.+)$/.exec(n)
    if (m) staged.add(`{stage}.${m[2]}`)
  }
  return [...[...staged].sort(), ...[...names].sort()]
}
