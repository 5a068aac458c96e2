import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterEach, describe, expect, it } from 'vitest'
import { CAUSES, QUANTITIES, SYMPTOMS, TESTS } from '#shared/types/diagnosis'
import { KnowledgeBaseImportError, loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { expandRule, ruleDefSchema, collectLeaves } from '#server/domain/diagnosis/knowledge-base'
import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'

const CONTENT = join(process.cwd(), 'content-src')
const temps: string[] = []

function copyContent(): string {
  const dir = join(mkdtempSync(join(tmpdir(), 'rimecase-kb-')), 'content-src')
  temps.push(dir)
  cpSync(CONTENT, dir, { recursive: true })
  return dir
}

afterEach(() => {
  for (const t of temps.splice(0)) rmSync(join(t, '..'), { recursive: true, force: true })
})

describe('seed knowledge base in content-src', () => {
  const kb = loadKnowledgeBaseFromDirectory(CONTENT)
  const prepared = kb.rules.flatMap(expandRule)

  it('loads and validates with at least 60 rules', () => {
    expect(kb.rules.length).toBeGreaterThanOrEqual(60)
    expect(kb.causes.map((c) => c.slug).sort()).toEqual([...CAUSES].sort())
    expect(kb.tests.map((t) => t.slug).sort()).toEqual([...TESTS].sort())
  })

  it('is deterministic across imports', () => {
    expect(JSON.stringify(loadKnowledgeBaseFromDirectory(CONTENT))).toBe(JSON.stringify(kb))
  })

  it('has evidence rules for every cause except the catch-all', () => {
    const covered = new Set(kb.rules.map((r) => r.event.params.cause))
    for (const c of CAUSES.filter((x) => x !== 'other')) expect(covered, c).toContain(c)
  })

  it('reads every symptom and every quantity of the contract in some rule', () => {
    const facts = new Set(prepared.flatMap((r) => collectLeaves(r.conditions).map((l) => l.fact)))
    for (const s of SYMPTOMS) expect(facts, s).toContain(`symptom.${s}`)
    const quantitiesRead = new Set([...facts].flatMap((f) => FACT_SPECS.get(f)?.needs ?? []))
    // setpoint feeds every "target" comparison; the cabinet target falls back to the design value.
    quantitiesRead.add('setpointTemperature')
    for (const q of QUANTITIES) expect(quantitiesRead, q).toContain(q)
  })

  it('covers cascade-only, single-stage and shared rules', () => {
    const stages = new Set(prepared.map((r) => r.stage))
    expect(stages).toEqual(new Set(['high', 'low', 'single']))
    expect(prepared.some((r) => r.facts.includes('cascadeHxAboveDesignK'))).toBe(true)
  })

  it('gives every test procedure numbered steps and every invasive test safety notes', () => {
    for (const t of kb.tests) {
      expect(t.procedure, t.slug).toMatch(/^1\. /m)
      expect(t.safetyNotes.length, t.slug).toBeGreaterThan(0)
    }
    const n2 = kb.tests.find((t) => t.slug === 'nitrogen-pressure-test')
    expect(n2?.safetyNotes.join(' ')).toMatch(/dry nitrogen/i)
    expect(n2?.safetyNotes.join(' ')).toMatch(/never oxygen/i)
  })
})

describe('import errors name the file and the field', () => {
  it('rejects a likelihood above 1', () => {
    const dir = copyContent()
    const file = join(dir, 'tests', 'leak-search.md')
    writeFileSync(file, readFileSync(file, 'utf8').replace('{ refrigerant-leak: 0.15, other: 0.06 }', '{ refrigerant-leak: 0.15, restriction: 1.4, other: 0.06 }'))
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError(KnowledgeBaseImportError)
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError(
      'content-src/tests/leak-search.md: outcomes[1].likelihoods.restriction must be between 0 and 1',
    )
  })

  it('rejects a rule with an unknown fact, a bad ratio and an unknown cause', () => {
    const dir = copyContent()
    const bad = [
      {
        name: 'broken',
        conditions: { all: [{ fact: '{stage}.superheat', operator: 'greaterThan', value: 5 }] },
        event: { type: 'evidence', params: { cause: 'gremlins', likelihoodRatio: 0, because: 'x' } },
      },
    ]
    writeFileSync(join(dir, 'rules', 'zz-broken.json'), JSON.stringify(bad))
    try {
      loadKnowledgeBaseFromDirectory(dir)
      expect.unreachable()
    } catch (e) {
      const issues = (e as KnowledgeBaseImportError).issues.join('\n')
      expect(issues).toContain('content-src/rules/zz-broken.json: [0] (broken) event.params.cause Unknown cause "gremlins"')
      expect(issues).toContain('event.params.likelihoodRatio must be greater than 0')
    }
  })

  it('rejects an unknown fact name in a rule', () => {
    expect(
      ruleDefSchema.safeParse({
        name: 'typo',
        conditions: { all: [{ fact: '{stage}.superheat', operator: 'greaterThan', value: 5 }] },
        event: { type: 'evidence', params: { cause: 'refrigerant-leak', likelihoodRatio: 2, because: 'x' } },
      }).error?.issues[0]?.message,
    ).toBe('unknown fact "high.superheat"')
  })

  it('rejects a missing cause file', () => {
    const dir = copyContent()
    rmSync(join(dir, 'causes', 'oil-logging.md'))
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError('content-src/causes: "oil-logging" is missing')
  })
})
