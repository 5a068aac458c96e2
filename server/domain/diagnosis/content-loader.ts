/**
 * Reads the knowledge base from its Markdown/JSON sources (content-src/) and validates every file
 * on its own first, so that an error names the file and the field at fault; then checks the
 * whole (every cause and test present, rules pointing at existing cause×stage pairs).
 * File order is sorted, so two imports of the same tree give identical results.
 */
import { readdirSync, readFileSync } from 'node:fs'
import { basename, join } from 'node:path'
import matter from 'gray-matter'
import type { z } from 'zod'
import {
  causeDefSchema,
  knowledgeBaseSourceSchema,
  ruleDefSchema,
  testDefSchema,
  type CauseDef,
  type KnowledgeBaseSource,
  type RuleDef,
  type TestDef,
} from './knowledge-base'

export class KnowledgeBaseImportError extends Error {
  constructor(readonly issues: string[]) {
    super(issues.length > 1 ? `${issues[0]} (and ${issues.length - 1} more problem(s))` : (issues[0] ?? 'invalid knowledge base'))
    this.name = 'KnowledgeBaseImportError'
  }
}

/** `outcomes[1].likelihoods.restriction` style, as a technician editing the file would search for it. */
export function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((acc, key) => {
    if (typeof key === 'number') return `${acc}[${key}]`
    return acc ? `${acc}.${String(key)}` : String(key)
  }, '')
}

function issueLines(label: string, error: z.ZodError, prefix = ''): string[] {
  return error.issues.map((i) => {
    const where = formatPath(i.path)
    return `${label}: ${prefix}${where ? `${where} ` : ''}${i.message}`
  })
}

function listFiles(dir: string, ext: string): string[] {
  try {
    return readdirSync(dir)
      .filter((f) => f.endsWith(ext))
      .sort()
  } catch {
    return []
  }
}

interface Collected<T> {
  items: T[]
  labels: string[]
}

function readMarkdown(dir: string, root: string, sub: string, bodyField: string, issues: string[]): Collected<Record<string, unknown>> {
  const out: Collected<Record<string, unknown>> = { items: [], labels: [] }
  for (const file of listFiles(join(dir, sub), '.md')) {
    const label = `${root}/${sub}/${file}`
    try {
      // Passing options turns off gray-matter's content cache, whose shared objects could leak edits between imports.
      const parsed = matter(readFileSync(join(dir, sub, file), 'utf8'), {})
      const data: Record<string, unknown> = { ...parsed.data, [bodyField]: parsed.content.trim() }
      if (data.slug !== file.replace(/\.md$/, '')) issues.push(`${label}: slug must equal the file name "${file.replace(/\.md$/, '')}"`)
      out.items.push(data)
      out.labels.push(label)
    } catch (e) {
      issues.push(`${label}: front matter does not parse (${(e as Error).message.split('\n')[0]})`)
    }
  }
  return out
}

function validateEach<T>(raw: Collected<unknown>, schema: z.ZodType<T>, issues: string[], prefixOf?: (i: number) => string): T[] {
  const valid: T[] = []
  raw.items.forEach((item, i) => {
    const r = schema.safeParse(item)
    if (r.success) valid.push(r.data)
    else issues.push(...issueLines(raw.labels[i] ?? '?', r.error, prefixOf?.(i)))
  })
  return valid
}

function readRules(dir: string, root: string, issues: string[]): Collected<unknown> {
  const out: Collected<unknown> = { items: [], labels: [] }
  const prefixes: string[] = []
  for (const file of listFiles(join(dir, 'rules'), '.json')) {
    const label = `${root}/rules/${file}`
    let parsed: unknown
    try {
      parsed = JSON.parse(readFileSync(join(dir, 'rules', file), 'utf8'))
    } catch (e) {
      issues.push(`${label}: not valid JSON (${(e as Error).message})`)
      continue
    }
    if (!Array.isArray(parsed)) {
      issues.push(`${label}: must be an array of rules`)
      continue
    }
    parsed.forEach((rule: unknown, i) => {
      // The file name is the rule's subject unless the rule names one itself.
      const withSubject = rule && typeof rule === 'object' ? { subject: basename(file, '.json'), ...rule } : rule
      out.items.push(withSubject)
      out.labels.push(label)
      const name = rule && typeof rule === 'object' && 'name' in rule ? String(rule.name) : '?'
      prefixes.push(`[${i}] (${name}) `)
    })
  }
  return Object.assign(out, { prefixes })
}

/** Issues of the whole base mapped back to the file that holds the offending item. */
function crossIssues(source: KnowledgeBaseSource, root: string, ruleLabels: string[], rulePrefixes: string[]): string[] {
  const r = knowledgeBaseSourceSchema.safeParse(source)
  if (r.success) return []
  return r.error.issues.map((i) => {
    const [field, index, ...rest] = i.path
    if (field === 'rules' && typeof index === 'number') {
      return `${ruleLabels[index]}: ${rulePrefixes[index] ?? ''}${formatPath(rest)} ${i.message}`.replace(/ {2,}/g, ' ')
    }
    return `${root}/${String(field)}: ${i.message}`
  })
}

export function loadKnowledgeBaseFromDirectory(dir: string): KnowledgeBaseSource {
  const root = basename(dir)
  const issues: string[] = []
  const causes = validateEach<CauseDef>(readMarkdown(dir, root, 'causes', 'description', issues), causeDefSchema, issues)
  const tests = validateEach<TestDef>(readMarkdown(dir, root, 'tests', 'procedure', issues), testDefSchema, issues)
  const rawRules = readRules(dir, root, issues) as Collected<unknown> & { prefixes: string[] }
  const rules = validateEach<RuleDef>(rawRules, ruleDefSchema, issues, (i) => rawRules.prefixes[i] ?? '')
  if (issues.length) throw new KnowledgeBaseImportError(issues)
  const source = { causes, tests, rules }
  const cross = crossIssues(source, root, rawRules.labels, rawRules.prefixes)
  if (cross.length) throw new KnowledgeBaseImportError(cross)
  return source
}
