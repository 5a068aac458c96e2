/** Field messages keyed like the API's `data.fieldErrors` ("stages.0.chargeG"), from zod issues. */
export function fieldErrorsFromIssues(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string[]> {
  const out: Record<string, string[]> = {}
  for (const issue of issues) (out[issue.path.map(String).join('.') || '_'] ??= []).push(issue.message)
  return out
}

/** The messages under `prefix.` with the prefix taken off, for a sub-form such as one stage. */
export function fieldErrorsUnder(errors: Record<string, string[]>, prefix: string): Record<string, string[]> {
  const start = `${prefix}.`
  return Object.fromEntries(Object.entries(errors).filter(([k]) => k.startsWith(start)).map(([k, v]) => [k.slice(start.length), v]))
}
