// Numbers as a technician types them on a phone: a decimal comma, a typographic minus or spaces
// between thousands are fine; anything else is refused with a message, never read as NaN.

export type ParsedDecimal = { state: 'empty' } | { state: 'ok'; value: number } | { state: 'invalid'; message: string }

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i

/** Reads a typed number; never yields NaN or Infinity. */
export function parseDecimal(text: string): ParsedDecimal {
  let s = text.trim().replace(/[\s\u00a0\u202f]/g, '').replace(/\u2212/g, '-')
  // A lone sign is a number being typed, not a mistake yet.
  if (s === '' || s === '-' || s === '+') return { state: 'empty' }
  // One comma and no point is a decimal comma (e.g. "1,5"); anything else with commas is ambiguous.
  if (!s.includes('.') && (s.match(/,/g) ?? []).length === 1) s = s.replace(',', '.')
  const value = Number(s)
  if (!DECIMAL.test(s) || !Number.isFinite(value)) return { state: 'invalid', message: 'Type a number, for example −80 or 1.5' }
  return { state: 'ok', value }
}

/**
 * Reads a number as typed on a phone keyboard: "" is "not known" (null); a decimal comma and the
 * typographic minus are accepted, because phones in many locales offer only those. Anything else
 * becomes NaN, which the zod schemas report as "must be a number".
 */
export function decimalOrNull(text: string): number | null {
  const typed = parseDecimal(text)
  if (typed.state === 'empty') return text.trim() === '' ? null : Number.NaN
  return typed.state === 'ok' ? typed.value : Number.NaN
}

/** A number as the form shows it again ("" for unknown). */
export function decimalText(value: number | null | undefined): string {
  return value === null || value === undefined ? '' : String(value)
}
