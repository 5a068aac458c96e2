import { describe, expect, it } from 'vitest'
import { Engine } from 'json-rules-engine'
import { compileScreen, CUSTOM_OPERATORS, prepareKnowledgeBase, renderText, runFindings } from '#server/domain/diagnosis/engine'
import type { KnowledgeBase, RuleDef, TopCondition } from '#server/domain/diagnosis/knowledge-base'
import { expandRule } from '#server/domain/diagnosis/rule-expansion'
import { seedKb } from './scenario-helpers'

const finding = (over: Partial<RuleDef> & Pick<RuleDef, 'name' | 'conditions'>): RuleDef => ({
  event: { type: 'finding', params: { stage: 'each', likelihoods: { healthy: 0.9, default: 0.5, other: 0.5, 'refrigerant-leak': 0.8 }, because: '{@Stage} superheat {stage.superheatK} K.' } },
  ...over,
})
const kbOf = (rules: RuleDef[], id = 't'): Pick<KnowledgeBase, 'version' | 'rules'> => ({ version: { id, label: id, status: 'draft' }, rules })

describe('custom operators', () => {
  it('compare numbers and refuse anything else (common practice, no source)', () => {
    expect(CUSTOM_OPERATORS.between?.(5, [0, 10])).toBe(true)
    expect(CUSTOM_OPERATORS.between?.(undefined, [0, 10])).toBe(false)
    expect(CUSTOM_OPERATORS.outside?.(11, [0, 10])).toBe(true)
    expect(CUSTOM_OPERATORS.withinPercent?.(1.05, [1, 8])).toBe(true)
    expect(CUSTOM_OPERATORS.withinPercent?.(1.1, [1, 8])).toBe(false)
    expect(CUSTOM_OPERATORS.outsidePercent?.(1.1, [1, 8])).toBe(true)
    expect(CUSTOM_OPERATORS.outsidePercent?.('1.1', [1, 8])).toBe(false)
  })
})

describe('stage expansion', () => {
  it('expands each, cabinet and ambient roles, groups and texts', () => {
    const each = expandRule(finding({ name: 'a', conditions: { all: [{ fact: '{stage}.superheatK', operator: 'greaterThan', value: 5 }] } }))
    expect(each.map((r) => r.id)).toEqual(['a@high', 'a@low', 'a@single'])
    expect(each[1]?.facts).toEqual(['low.superheatK'])
    expect(each[1]?.about).toBe('low')
    expect(each[1]?.because['*']).toBe('Low stage superheat {low.superheatK} K.')
    const cab = expandRule({
      name: 'b',
      conditions: { all: [{ fact: 'cabinetC', operator: 'greaterThan', value: 0 }] },
      event: { type: 'finding', params: { stage: 'cabinet', about: 'unit', group: 'cab@{stage}', likelihoods: { healthy: 0.5, default: 0.5, other: 0.5 }, because: 'x' } },
    })
    expect(cab.map((r) => r.id)).toEqual(['b@low', 'b@single'])
    expect(cab[0]?.facts).toEqual(['cabinetC', 'unit.kind'])
    expect(cab[0]?.about).toBeUndefined()
    expect(cab[0]?.group).toBe('cab@low')
  })
})

describe('running findings', () => {
  it('a finding with a missing fact does not apply and does not crash; it is listed as waiting', async () => {
    const prepared = prepareKnowledgeBase(kbOf([finding({ name: 'sh', conditions: { all: [{ fact: '{stage}.superheatK', operator: 'greaterThan', value: 5 }, { fact: '{stage}.subcoolingK', operator: 'lessThan', value: 2 }] } })]))
    const run = await runFindings(prepared, { 'low.superheatK': 20 })
    expect(run.applied).toEqual([])
    expect(run.evaluated).toBe(0)
    expect(run.waiting.find((w) => w.finding.id === 'sh@low')?.missing).toEqual(['low.subcoolingK'])
    const run2 = await runFindings(prepared, { 'low.superheatK': 20, 'low.subcoolingK': 1 })
    expect(run2.applied.map((f) => f.id)).toEqual(['sh@low'])
  })

  it('reuses the prepared engine per knowledge-base version and rebuilds an edited draft', () => {
    const rules = [finding({ name: 'x', conditions: { all: [{ fact: '{stage}.superheatK', operator: 'greaterThan', value: 5 }] } })]
    const a = prepareKnowledgeBase(kbOf(rules, 'v1'))
    expect(prepareKnowledgeBase(kbOf(rules, 'v1'))).toBe(a)
    expect(prepareKnowledgeBase(kbOf([...rules], 'v1'))).not.toBe(a)
    expect(prepareKnowledgeBase(kbOf(rules, 'v2'))).not.toBe(a)
  })

  it('the seed base never sees undefined facts: findings apply only with all their facts', async () => {
    const prepared = prepareKnowledgeBase(seedKb())
    const facts = { 'unit.kind': 'single-stage', 'symptom.not-cooling': true }
    const run = await runFindings(prepared, facts)
    for (const f of run.applied) expect(f.facts.every((name) => name in facts)).toBe(true)
    expect(run.applied.length).toBeGreaterThan(0)
  })

  it('renders values with sensible precision', () => {
    expect(renderText('{a} kPa, {b} K, {c}, {d}', { a: 1999.39, b: -3.456, c: true, d: 'R290' })).toBe('1999 kPa, -3.5 K, yes, R290')
    expect(renderText('{abs:b} K below', { b: -8.14 })).toBe('8.1 K below')
  })
})

describe('the compiled screen in front of json-rules-engine', () => {
  const cases: [TopCondition, Record<string, number | string | boolean>][] = [
    [{ all: [{ fact: 'a', operator: 'greaterThan', value: 2 }, { fact: 'b', operator: 'equal', value: 'x' }] }, { a: 3, b: 'x' }],
    [{ all: [{ fact: 'a', operator: 'greaterThan', value: 2 }, { fact: 'b', operator: 'equal', value: 'x' }] }, { a: 2, b: 'x' }],
    [{ any: [{ fact: 'a', operator: 'lessThanInclusive', value: 2 }, { fact: 'b', operator: 'in', value: ['y', 'z'] }] }, { a: 3, b: 'z' }],
    [{ not: { fact: 'a', operator: 'between', value: [1, 5] } }, { a: 7, b: 'x' }],
    [{ all: [{ not: { fact: 'b', operator: 'notIn', value: ['x'] } }, { fact: 'a', operator: 'outsidePercent', value: [10, 5] }] }, { a: 11, b: 'x' }],
    [{ all: [] }, { a: 1 }],
  ]

  it('agrees with json-rules-engine itself on every operator and combinator', async () => {
    for (const [conditions, facts] of cases) {
      const engine = new Engine([{ conditions: conditions as never, event: { type: 'hit' } }], { allowUndefinedFacts: true })
      for (const [name, fn] of Object.entries(CUSTOM_OPERATORS)) engine.addOperator(name, fn)
      const { events } = await engine.run(facts)
      expect(compileScreen(conditions)(facts), JSON.stringify(conditions)).toBe(events.length === 1)
    }
  })
})
