/**
 * The knowledge-base bundle: one version of an organisation's knowledge base as a single JSON
 * document, for export, review outside the app and import into another organisation or back.
 * Format: `format` and `formatVersion` identify it; `causes`, `tests` and `rules` are exactly the
 * shapes of the content-src files (content-src/README.md); `examples` maps a finding's name to its
 * worked examples. The JSON Schema generated from this module is kept in
 * docs/knowledge-base-bundle.schema.json (scripts/kb-bundle-schema.ts writes it; a unit test keeps
 * it in step). A bundle is checked whole before anything is stored.
 */
import { z } from 'zod'
import { causeDefSchema, checkCrossReferences, ruleDefSchema, testDefSchema, type KnowledgeBaseSource } from '#server/domain/diagnosis/knowledge-base'
import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'
import { findingExamplesSchema, type FindingExample } from './examples-schema'

export const BUNDLE_FORMAT = 'rimecase-knowledge-base'
export const BUNDLE_FORMAT_VERSION = 1

export const knowledgeBaseBundleSchema = z
  .object({
    format: z.literal(BUNDLE_FORMAT, { error: `must be "${BUNDLE_FORMAT}"` }),
    formatVersion: z.literal(BUNDLE_FORMAT_VERSION, { error: `must be ${BUNDLE_FORMAT_VERSION}` }),
    /** What the version is called in lists. */
    label: z.string().trim().min(1, 'Give the bundle a label').max(120),
    /** When and from which version it was exported; informative only. */
    exportedAt: z.string().optional(),
    exportedFrom: z.object({ versionId: z.number().int(), status: z.string() }).optional(),
    causes: z.array(causeDefSchema),
    tests: z.array(testDefSchema),
    rules: z.array(ruleDefSchema),
    examples: z.record(z.string(), findingExamplesSchema).optional(),
  })
  .strict()
  .superRefine((bundle, ctx) => {
    checkCrossReferences(bundle, ctx)
    const names = new Set(bundle.rules.map((r) => r.name))
    for (const [name, examples] of Object.entries(bundle.examples ?? {})) {
      if (!names.has(name)) ctx.addIssue({ code: 'custom', path: ['examples', name], message: `no finding is named "${name}"` })
      examples.forEach((example, i) => {
        for (const fact of Object.keys(example.facts)) {
          if (!FACT_SPECS.has(fact)) ctx.addIssue({ code: 'custom', path: ['examples', name, i, 'facts', fact], message: `unknown fact "${fact}"` })
        }
      })
    }
  })
export type KnowledgeBaseBundle = z.infer<typeof knowledgeBaseBundleSchema>

/** A version's content and examples as a bundle. */
export function toBundle(
  source: KnowledgeBaseSource,
  examples: Record<string, FindingExample[]>,
  meta: { label: string; versionId: number; status: string; exportedAt: Date },
): KnowledgeBaseBundle {
  const withExamples = Object.fromEntries(Object.entries(examples).filter(([, list]) => list.length > 0))
  return {
    format: BUNDLE_FORMAT,
    formatVersion: BUNDLE_FORMAT_VERSION,
    label: meta.label,
    exportedAt: meta.exportedAt.toISOString(),
    exportedFrom: { versionId: meta.versionId, status: meta.status },
    causes: source.causes,
    tests: source.tests,
    rules: source.rules,
    ...(Object.keys(withExamples).length ? { examples: withExamples } : {}),
  }
}

/** The JSON Schema of the bundle (refinements such as cross-references are checked on import only). */
export function bundleJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(knowledgeBaseBundleSchema, { unrepresentable: 'any', io: 'input' }),
    $id: 'https://rimecase.invalid/schemas/knowledge-base-bundle.schema.json',
    title: 'Rimecase knowledge-base bundle',
    description: 'One version of a Rimecase knowledge base: causes, tests, findings (json-rules-engine rules with likelihood tables) and worked examples. See docs/knowledge-base-bundle.md.',
  }
}
