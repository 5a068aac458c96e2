import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterEach, describe, expect, it } from 'vitest'
import { CAUSES, QUANTITIES, SYMPTOMS, TESTS, isStagelessCause } from '#shared/types/diagnosis'
import { KnowledgeBaseImportError, loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { ruleDefSchema } from '#server/domain/diagnosis/knowledge-base'
import { collectLeaves, expandRule } from '#server/domain/diagnosis/rule-expansion'
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

  it('loads and validates, with every cause and test word defined once', () => {
    expect(kb.rules.length).toBeGreaterThanOrEqual(35)
    expect(kb.causes.map((c) => c.slug).sort()).toEqual([...CAUSES].sort())
    expect(kb.tests.map((t) => t.slug).sort()).toEqual([...TESTS].sort())
  })

  it('is deterministic across imports', () => {
    expect(JSON.stringify(loadKnowledgeBaseFromDirectory(CONTENT))).toBe(JSON.stringify(kb))
  })

  it('names every cause in some finding, so each has evidence for and against', () => {
    const named = new Set(kb.rules.flatMap((r) => Object.keys(r.event.params.likelihoods).map((k) => k.split('@')[0])))
    for (const c of CAUSES.filter((x) => !isStagelessCause(x))) expect(named, c).toContain(c)
  })

  it('reads every symptom and every quantity of the contract in some finding', () => {
    const facts = new Set(prepared.flatMap((r) => [...collectLeaves(r.conditions).map((l) => l.fact), ...(r.measure ? [r.measure.fact] : [])]))
    for (const s of SYMPTOMS) expect(facts, s).toContain(`symptom.${s}`)
    const quantitiesRead = new Set([...facts].flatMap((f) => FACT_SPECS.get(f)?.needs ?? []))
    // setpoint feeds every "target" comparison; the cabinet target falls back to the design value.
    quantitiesRead.add('setpointTemperature')
    for (const q of QUANTITIES) expect(quantitiesRead, q).toContain(q)
  })

  it('covers cascade-only, single-stage and shared findings', () => {
    const stages = new Set(prepared.map((r) => r.stage))
    expect(stages).toEqual(new Set(['high', 'low', 'single', undefined]))
    expect(prepared.some((r) => r.measure?.fact === 'cascadeHxAboveDesignK')).toBe(true)
  })

  it('gives every test procedure numbered steps and every test safety notes; never oxygen or air for pressure tests', () => {
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
    writeFileSync(file, readFileSync(file, 'utf8').replace('{ healthy: 0.08, default: 0.08, refrigerant-leak: 0.13,', '{ healthy: 0.08, default: 0.08, restriction: 1.4, refrigerant-leak: 0.13,'))
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError(KnowledgeBaseImportError)
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError('content-src/tests/leak-search.md: outcomes[1].likelihoods.restriction must be between 0 and 1')
  })

  it('rejects outcome tables that do not sum to 1 for a cause', () => {
    const dir = copyContent()
    const file = join(dir, 'tests', 'condenser-inspection.md')
    writeFileSync(file, readFileSync(file, 'utf8').replace('condenser-airflow: 0.92', 'condenser-airflow: 0.5'))
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError(/condenser-inspection\.md: outcomes likelihoods of condenser-airflow on the tested stage .* sum to 0\.580/)
  })

  it('rejects a finding with an unknown fact, an unknown cause key and a missing default', () => {
    const dir = copyContent()
    const bad = [
      {
        name: 'broken',
        conditions: { all: [{ fact: '{stage}.superheat', operator: 'greaterThan', value: 5 }] },
        event: { type: 'finding', params: { stage: 'each', likelihoods: { healthy: 0.5, other: 0.5, gremlins: 0.9 }, because: 'x' } },
      },
    ]
    writeFileSync(join(dir, 'rules', 'zz-broken.json'), JSON.stringify(bad))
    try {
      loadKnowledgeBaseFromDirectory(dir)
      expect.unreachable()
    } catch (e) {
      const issues = (e as KnowledgeBaseImportError).issues.join('\n')
      expect(issues).toContain('content-src/rules/zz-broken.json: [0] (broken) event.params.likelihoods.default is required')
      expect(issues).toContain('event.params.likelihoods.gremlins unknown key "gremlins"')
      expect(issues).toContain('conditions unknown fact "high.superheat"')
    }
  })

  it('rejects a graded finding that predicts a band it does not define, and band weights that do not sum to 1', () => {
    const r = ruleDefSchema.safeParse({
      name: 'graded',
      conditions: { all: [] },
      event: {
        type: 'finding',
        params: {
          stage: 'single',
          measure: { fact: '{stage}.superheatK', sigma: 1, unit: 'K', bands: { low: [-5, 3], normal: [3, 14], high: [14, 40] } },
          likelihoods: { healthy: 'normal', default: { normal: 0.5, high: 0.2 }, other: 'any', 'refrigerant-leak': 'very-high' },
          because: { low: 'a', normal: 'b', high: 'c' },
        },
      },
    })
    const messages = r.error?.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('\n') ?? ''
    expect(messages).toContain('unknown band "very-high"')
    expect(messages).toContain('band weights sum to 0.700')
  })

  it('rejects bands with a gap between them', () => {
    const r = ruleDefSchema.safeParse({
      name: 'gap',
      conditions: { all: [] },
      event: { type: 'finding', params: { stage: 'single', measure: { fact: '{stage}.superheatK', sigma: 1, unit: 'K', bands: { low: [-5, 3], high: [4, 40] } }, likelihoods: { healthy: 'low', default: 'low', other: 'any' }, because: 'x' } },
    })
    expect(r.error?.issues[0]?.message).toBe('bands must touch: one ends at 3, the next starts at 4')
  })

  it('rejects a missing cause file', () => {
    const dir = copyContent()
    rmSync(join(dir, 'causes', 'oil-logging.md'))
    expect(() => loadKnowledgeBaseFromDirectory(dir)).toThrowError('content-src/causes: "oil-logging" is missing')
  })
})
