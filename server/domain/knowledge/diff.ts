/**
 * A readable diff of two versions of a knowledge base: which causes, tests and findings were added,
 * removed or changed, and for a changed one each field that differs with its value before and after
 * (paths such as `event.params.likelihoods.restriction`).
 */
import type { KnowledgeBaseSource } from '#server/domain/diagnosis/knowledge-base'
import type { FindingExample } from './examples-schema'

import type { DiffItem, DiffItemKind, FieldChange } from '#shared/types/knowledge'

export type { DiffItem, DiffItemKind, FieldChange } from '#shared/types/knowledge'

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v)

/** Leaf-level differences between two JSON values; arrays of scalars compare whole. */
export function jsonDiff(before: unknown, after: unknown, path = ''): FieldChange[] {
  if (JSON.stringify(before) === JSON.stringify(after)) return []
  if (isObject(before) && isObject(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort()
    return keys.flatMap((k) => jsonDiff(before[k], after[k], path ? `${path}.${k}` : k))
  }
  if (Array.isArray(before) && Array.isArray(after) && before.length === after.length && before.some((x) => typeof x === 'object' && x !== null)) {
    return before.flatMap((x, i) => jsonDiff(x, after[i], `${path}[${i}]`))
  }
  return [{ path: path || '(whole)', ...(before === undefined ? {} : { before }), ...(after === undefined ? {} : { after }) }]
}

type Side = Pick<KnowledgeBaseSource, 'causes' | 'tests' | 'rules'> & { examples?: Record<string, FindingExample[]> }

function diffList<T>(kind: DiffItemKind, before: T[], after: T[], keyOf: (t: T) => string, extra?: (key: string) => [unknown, unknown]): DiffItem[] {
  const a = new Map(before.map((x) => [keyOf(x), x]))
  const b = new Map(after.map((x) => [keyOf(x), x]))
  const out: DiffItem[] = []
  for (const [key, x] of b) {
    const old = a.get(key)
    if (old === undefined) {
      out.push({ kind, key, change: 'added', fields: [] })
      continue
    }
    const fields = jsonDiff(old, x)
    if (extra) {
      const [eb, ea] = extra(key)
      fields.push(...jsonDiff(eb ?? [], ea ?? [], 'examples'))
    }
    if (fields.length) out.push({ kind, key, change: 'changed', fields })
  }
  for (const key of a.keys()) if (!b.has(key)) out.push({ kind, key, change: 'removed', fields: [] })
  return out
}

/** What changed from `base` (usually the published version) to `next` (a draft). */
export function diffKnowledgeBases(base: Side, next: Side): DiffItem[] {
  return [
    ...diffList('cause', base.causes, next.causes, (c) => c.slug),
    ...diffList('test', base.tests, next.tests, (t) => t.slug),
    ...diffList('finding', base.rules, next.rules, (r) => r.name, (name) => [base.examples?.[name], next.examples?.[name]]),
  ]
}
