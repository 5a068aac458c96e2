/** Field messages of an API error (`data.fieldErrors`), or an empty object. */
export function fieldErrorsOf(error: unknown): Record<string, string[]> {
  const data = (error as { data?: { data?: { fieldErrors?: Record<string, string[]> } } })?.data?.data
  return data?.fieldErrors ?? {}
}

/** A short sentence for the user from any API error. */
export function messageOf(error: unknown, fallback = 'Something went wrong. Try again.'): string {
  const e = error as { data?: { message?: string }; statusCode?: number; message?: string }
  if (e?.statusCode === undefined && e?.message?.includes('fetch')) return 'No connection to Rimecase. Check the network and try again.'
  return e?.data?.message || fallback
}
