import { parseDecimal } from './figures'

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
