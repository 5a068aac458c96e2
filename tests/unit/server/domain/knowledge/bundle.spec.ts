import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { bundleJsonSchema, knowledgeBaseBundleSchema, toBundle } from '#server/domain/knowledge/bundle'
import { zodFieldErrors } from '#shared/utils/input-errors'
import { seedKb } from '../diagnosis/scenario-helpers'

const bundleOfSeed = () => {
  const { version: _version, ...source } = seedKb()
  return toBundle(structuredClone(source), { 'cabinet-against-target': [{ title: 'Warm cabinet', facts: { cabinetAboveTargetK: 12 }, expect: 'fires' }] }, {
    label: 'Seed', versionId: 7, status: 'published', exportedAt: new Date('2026-12-01T10:00:00Z'),
  })
}

describe('knowledge-base bundle', () => {
  it('round-trips the seed knowledge base with its examples', () => {
    const bundle = JSON.parse(JSON.stringify(bundleOfSeed()))
    const parsed = knowledgeBaseBundleSchema.safeParse(bundle)
    expect(parsed.success, parsed.success ? '' : JSON.stringify(parsed.error.issues.slice(0, 3))).toBe(true)
    expect(parsed.data!.rules.length).toBe(seedKb().rules.length)
    expect(bundle).toMatchObject({ format: 'rimecase-knowledge-base', formatVersion: 1, exportedFrom: { versionId: 7, status: 'published' } })
  })

  it('refuses a malformed bundle with the field at fault', () => {
    const bundle = JSON.parse(JSON.stringify(bundleOfSeed()))
    bundle.rules[0].event.params.likelihoods.healthy = 7
    const parsed = knowledgeBaseBundleSchema.safeParse(bundle)
    expect(parsed.success).toBe(false)
    expect(zodFieldErrors(parsed.error!)['rules.0.event.params.likelihoods.healthy']?.join()).toMatch(/between 0 and 1/)

    const incomplete = JSON.parse(JSON.stringify(bundleOfSeed()))
    incomplete.causes = incomplete.causes.filter((c: { slug: string }) => c.slug !== 'restriction')
    expect(zodFieldErrors(knowledgeBaseBundleSchema.safeParse(incomplete).error!).causes?.join()).toMatch(/"restriction" is missing/)

    const wrongFormat = { ...bundleOfSeed(), format: 'something-else' }
    expect(zodFieldErrors(knowledgeBaseBundleSchema.safeParse(wrongFormat).error!).format?.join()).toMatch(/rimecase-knowledge-base/)
  })

  it('refuses examples of a finding that does not exist or naming unknown facts', () => {
    const bundle = JSON.parse(JSON.stringify(bundleOfSeed()))
    bundle.examples = { 'no-such-finding': [{ title: 'x', facts: { notAFact: 1 }, expect: 'fires' }] }
    const fields = zodFieldErrors(knowledgeBaseBundleSchema.safeParse(bundle).error!)
    expect(fields['examples.no-such-finding']?.join()).toMatch(/no finding is named/)
    expect(fields['examples.no-such-finding.0.facts.notAFact']?.join()).toMatch(/unknown fact/)
  })

  it('keeps its JSON Schema file in the repository in step with the zod schema (npm run kb:schema)', () => {
    const committed = JSON.parse(readFileSync(join(process.cwd(), 'docs/knowledge-base-bundle.schema.json'), 'utf8'))
    expect(committed).toEqual(JSON.parse(JSON.stringify(bundleJsonSchema())))
    expect(committed.required).toEqual(expect.arrayContaining(['format', 'formatVersion', 'label', 'causes', 'tests', 'rules']))
  })
})
