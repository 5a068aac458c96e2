// Text that cannot be stored or shown faithfully: the NUL character (PostgreSQL text refuses it)
// and lone UTF-16 surrogates (half of a character, not valid Unicode). One refinement refuses both
// in every string of every input the API reads, keys included, naming the field.
import { z } from 'zod'

const UNSAFE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/

export const UNSAFE_TEXT_MESSAGE = 'Contains a character that cannot be stored (a NUL or half of a character); remove it'

/** True when the text holds a NUL character or a lone surrogate. */
export function hasUnsafeCharacters(text: string): boolean {
  return UNSAFE.test(text)
}

/** Adds an issue at the path of every string (or key) in `value` that holds an unsafe character. */
export function refuseUnsafeText(value: unknown, ctx: z.RefinementCtx, path: (string | number)[] = [], depth = 0): void {
  if (depth > 64) return
  if (typeof value === 'string') {
    if (UNSAFE.test(value)) ctx.addIssue({ code: 'custom', message: UNSAFE_TEXT_MESSAGE, path })
    return
  }
  if (Array.isArray(value)) {
    value.forEach((item, i) => refuseUnsafeText(item, ctx, [...path, i], depth + 1))
    return
  }
  if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (UNSAFE.test(key)) ctx.addIssue({ code: 'custom', message: UNSAFE_TEXT_MESSAGE, path })
      refuseUnsafeText(item, ctx, [...path, key], depth + 1)
    }
  }
}

/** Any input, refused when a string anywhere in it holds an unsafe character; the API reads every body, query and path through it. */
export const SafeInputSchema = z.unknown().superRefine((value, ctx) => refuseUnsafeText(value, ctx))

/** A free-text field: trimmed, at most `max` characters, without unsafe characters (for forms as well as the API). */
export function safeText(max: number, tooLong = `Keep it under ${max} characters`) {
  return z.string().trim().max(max, tooLong).refine((s) => !UNSAFE.test(s), UNSAFE_TEXT_MESSAGE)
}
