/** The messages under `prefix.` with the prefix taken off, for a sub-form such as one stage. */
export function fieldErrorsUnder(errors: Record<string, string[]>, prefix: string): Record<string, string[]> {
  const start = `${prefix}.`
  return Object.fromEntries(Object.entries(errors).filter(([k]) => k.startsWith(start)).map(([k, v]) => [k.slice(start.length), v]))
}
