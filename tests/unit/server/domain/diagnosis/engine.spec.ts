import { describe, expect, it } from 'vitest'
import { CUSTOM_OPERATORS, prepareKnowledgeBase, renderBecause, runRules } from '#server/domain/diagnosis/engine'
import type { KnowledgeBase, RuleDef } from '#server/domain/diagnosis/knowledge-base'
import { expandRule } from '#server/domain/diagnosis/knowledge-base'
import { seedKb } from './scenario-helpers'

const rule = (over: Partial<RuleDef> & Pick<RuleDef, 'name' | 'conditions'>): RuleDef => ({
  event: { type: 'evidence', params: { cause: 'refrigerant-leak', stage: 'each', likelihoodRatio: 2, because: '{@Stage} superheat {stage.superheatK} K.' } },
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
  it('expands each, cabinet and ambient roles', () => {
    const each = expandRule(rule({ name: 'a', conditions: { all: [{ fact: '{stage}.superheatK', operator: 'greaterThan', value: 5 }] } }))
    expect(each.map((r) => r.id)).toEqual(['a@high', 'a@low', 'a@single'])
    expect(each[1]?.facts).toEqual(['low.superheatK'])
    expect(each[1]?.because).toBe('Low stage superheat {low.superheatK} K.')
    const cab = expandRule({ ...rule({ name: 'b', conditions: { all: [{ fact: 'cabinetC', operator: 'greaterThan', value: 0 }] } }), event: { type: 'evidence', params: { cause: 'high-heat-load', stage: 'cabinet', likelihoodRatio: 2, because: 'x' } } })
    expect(cab.map((r) => r.id)).toEqual(['b@low', 'b@single'])
    expect(cab[0]?.facts).toEqual(['cabinetC', 'unit.kind'])
  })
})

describe('running rules', () => {
  it('a rule with a missing fact does not fire and does not crash; it is listed as waiting', async () => {
    const prepared = prepareKnowledgeBase(kbOf([rule({ name: 'sh', conditions: { all: [{ fact: '{stage}.superheatK', operator: 'greaterThan', value: 5 }, { fact: '{stage}.subcoolingK', operator: 'lessThan', value: 2 }] } })]))
    const run = await runRules(prepared, { 'low.superheatK': 20 })
    expect(run.fired).toEqual([])
    expect(run.evaluated).toBe(0)
    expect(run.waiting.find((w) => w.rule.id === 'sh@low')?.missing).toEqual(['low.subcoolingK'])
    const run2 = await runRules(prepared, { 'low.superheatK': 20, 'low.subcoolingK': 1 })
    expect(run2.fired.map((f) => f.rule.id)).toEqual(['sh@low'])
    expect(run2.fired[0]?.text).toBe('Low stage superheat 20.0 K.')
  })

  it('reuses the prepared engine per knowledge-base version and rebuilds an edited draft', () => {
    const rules = [rule({ name: 'x', conditions: { all: [{ fact: '{stage}.superheatK', operator: 'greaterThan', value: 5 }] } })]
    const a = prepareKnowledgeBase(kbOf(rules, 'v1'))
    expect(prepareKnowledgeBase(kbOf(rules, 'v1'))).toBe(a)
    expect(prepareKnowledgeBase(kbOf([...rules], 'v1'))).not.toBe(a)
    expect(prepareKnowledgeBase(kbOf(rules, 'v2'))).not.toBe(a)
  })

  it('the seed base never sees undefined facts: rules run only with all their facts', async () => {
    const prepared = prepareKnowledgeBase(seedKb())
    const run = await runRules(prepared, { 'unit.kind': 'single-stage', 'symptom.not-cooling': true })
    for (const f of run.fired) expect(f.rule.facts.every((name) => ['unit.kind', 'symptom.not-cooling'].includes(name))).toBe(true)
    expect(run.fired.length).toBeGreaterThan(0)
  })

  it('renders values with sensible precision', () => {
    expect(renderBecause('{a} kPa, {b} K, {c}, {d}', { a: 1999.39, b: -3.456, c: true, d: 'R290' })).toBe('1999 kPa, -3.5 K, yes, R290')
  })
})
