// The one place where zod issues become the field errors forms and the API share: messages keyed by
// the dotted field path ("stages.0.chargeG"), and a one-line summary that names the field in words.
import { z } from 'zod'
import { fieldMessage } from './vocabulary/fields'

/** Field messages keyed like the API's `data.fieldErrors`; form-level messages go under "_". */
export type FieldErrors = Record<string, string[]>

type Tree = { errors: string[]; properties?: Record<string, Tree>; items?: (Tree | undefined)[] }

// zod's own tree already unfolds union and element issues into the fields they concern.
function walk(tree: Tree, path: (string | number)[], visit: (path: (string | number)[], messages: string[]) => void) {
  if (tree.errors.length) visit(path, tree.errors)
  for (const [key, child] of Object.entries(tree.properties ?? {})) walk(child, [...path, key], visit)
  tree.items?.forEach((child, i) => child && walk(child, [...path, i], visit))
}

/** Field messages of a zod error, keyed by dotted path. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {}
  walk(z.treeifyError(error) as Tree, [], (path, messages) => (out[path.join('.') || '_'] ??= []).push(...messages))
  return out
}

/** One sentence about the first problem, naming its field in words, and how many more there are. */
export function zodSummary(error: z.ZodError): string {
  const found: string[] = []
  walk(z.treeifyError(error) as Tree, [], (path, messages) => messages.forEach((m) => found.push(fieldMessage(path, m))))
  if (!found.length) return 'Some input needs another look.'
  return found.length === 1 ? found[0]! : `${found[0]} (and ${found.length - 1} more)`
}

/** Every problem of a zod error as a sentence naming its field, for a list at the top of a form. */
export function zodMessages(error: z.ZodError): string[] {
  const found: string[] = []
  walk(z.treeifyError(error) as Tree, [], (path, messages) => messages.forEach((m) => found.push(fieldMessage(path, m))))
  return found
}
