/**
 * Runs the evidence rules of a knowledge-base version with json-rules-engine.
 *
 * Speed comes from three things: (1) one prepared Engine per version (rules expanded, parsed into
 * json-rules-engine Rule objects and operators registered once), (2) an index of the facts each
 * rule reads, so that a run hands the engine only the rules whose facts are all present, and
 * (3) an equality index: top-level `equal` tests (symptoms, unit kind) are checked before the
 * engine is called, since most rules hinge on a symptom that is absent. A rule
 * with a missing fact therefore never fires and never sees `undefined`; instead the reading it
 * waits for is reported so the technician knows what would sharpen the ranking.
 */
import { Engine, Rule, type EngineResult } from 'json-rules-engine'
import { isStageQuantity, type Quantity, type Stage, type UnitKind } from '#shared/types/diagnosis'
import { FACT_SPECS } from './fact-vocabulary'
import type { FactValue, Facts } from './facts'
import { expandRule, placeholdersOf, type KnowledgeBase, type PreparedRule, type RuleDef } from './knowledge-base'

// ------------------------------------------------------------------ operators

const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v)
const isPair = (v: unknown): v is [number, number] => Array.isArray(v) && v.length === 2 && isNum(v[0]) && isNum(v[1])

/** Custom operators return false on anything but finite numbers, so a stray value cannot throw. */
export const CUSTOM_OPERATORS: Record<string, (fact: unknown, value: unknown) => boolean> = {
  between: (f, v) => isNum(f) && isPair(v) && f >= v[0] && f <= v[1],
  outside: (f, v) => isNum(f) && isPair(v) && (f < v[0] || f > v[1]),
  withinPercent: (f, v) => isNum(f) && isPair(v) && Math.abs(f - v[0]) <= (Math.abs(v[0]) * v[1]) / 100,
  outsidePercent: (f, v) => isNum(f) && isPair(v) && Math.abs(f - v[0]) > (Math.abs(v[0]) * v[1]) / 100,
}

/** An Engine that evaluates a chosen subset of its rules; the subset is read synchronously by run(). */
class SubsetEngine extends Engine {
  private pending: Rule[] = []

  runSubset(facts: Facts, rules: Rule[]): Promise<EngineResult> {
    this.pending = rules
    const result = this.run(facts)
    this.pending = []
    return result
  }

  /** Replaces the library's priority grouping: all our rules share one priority. */
  prioritizeRules(): Rule[][] {
    return [this.pending]
  }
}

export function createRuleEngine(rules: { name: string; conditions: unknown; id: string }[]): { engine: SubsetEngine; compiled: Rule[] } {
  const engine = new SubsetEngine([], { allowUndefinedFacts: true })
  for (const [name, fn] of Object.entries(CUSTOM_OPERATORS)) engine.addOperator(name, fn)
  const compiled = rules.map((r) => {
    const rule = new Rule({ name: r.id, conditions: r.conditions as never, event: { type: 'evidence', params: { id: r.id } } })
    engine.addRule(rule)
    return rule
  })
  return { engine, compiled }
}

// ------------------------------------------------------------------ prepared versions

export interface PreparedKnowledgeBase {
  rules: PreparedRule[]
  byId: Map<string, PreparedRule>
  engine: SubsetEngine
  compiled: Rule[]
  source: RuleDef[]
}

const cache = new Map<string, PreparedKnowledgeBase>()
const CACHE_LIMIT = 16

/** One prepared engine per version; an edited draft (new rules array) is prepared again. */
export function prepareKnowledgeBase(kb: Pick<KnowledgeBase, 'version' | 'rules'>): PreparedKnowledgeBase {
  const key = `${kb.version.id}:${kb.version.status}`
  const hit = cache.get(key)
  if (hit && hit.source === kb.rules) return hit
  const rules = kb.rules.flatMap(expandRule)
  const { engine, compiled } = createRuleEngine(rules)
  const prepared: PreparedKnowledgeBase = { rules, byId: new Map(rules.map((r) => [r.id, r])), engine, compiled, source: kb.rules }
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value ?? '')
  cache.set(key, prepared)
  return prepared
}

export function clearPreparedCache(): void {
  cache.clear()
}

// ------------------------------------------------------------------ running

export interface FiredRule {
  rule: PreparedRule
  text: string
}

export interface RuleRun {
  fired: FiredRule[]
  /** Rules left out because at least one of their facts is missing. */
  waiting: { rule: PreparedRule; missing: string[] }[]
  evaluated: number
}

export function missingFacts(rule: PreparedRule, facts: Facts): string[] {
  return rule.facts.filter((f) => facts[f] === undefined)
}

/** Equality index: an `all` holding `symptom.x equal true` cannot fire while the symptom is false. */
function equalsHold(rule: PreparedRule, facts: Facts): boolean {
  return rule.requiredEquals.every(([fact, value]) => facts[fact] === value)
}

export async function runRules(prepared: PreparedKnowledgeBase, facts: Facts): Promise<RuleRun> {
  const selected: Rule[] = []
  const waiting: RuleRun['waiting'] = []
  prepared.rules.forEach((rule, i) => {
    const missing = missingFacts(rule, facts)
    if (missing.length) waiting.push({ rule, missing })
    else if (equalsHold(rule, facts)) selected.push(prepared.compiled[i] as Rule)
  })
  const result = await prepared.engine.runSubset(facts, selected)
  const fired = result.events.flatMap((e) => {
    const rule = prepared.byId.get(String(e.params?.id))
    return rule ? [{ rule, text: renderBecause(rule.because, facts) }] : []
  })
  return { fired, waiting, evaluated: selected.length }
}

// ------------------------------------------------------------------ rendering

export function formatFact(v: FactValue | undefined): string {
  if (v === undefined) return '?'
  if (typeof v === 'boolean') return v ? 'yes' : 'no'
  if (typeof v === 'string') return v
  if (Math.abs(v) >= 100) return String(Math.round(v))
  return (Math.round(v * 10) / 10).toFixed(1)
}

/** Fills `{fact}` placeholders with the values measured or derived for this case. */
export function renderBecause(template: string, facts: Facts): string {
  let out = template
  for (const name of placeholdersOf(template)) out = out.replaceAll(`{${name}}`, formatFact(facts[name]))
  return out
}

// ------------------------------------------------------------------ what would sharpen

export interface WaitingReading {
  quantity: Quantity
  stage?: Stage
  rulesWaiting: number
}

/** Reading keys (`quantity` or `stage:quantity`) a fact is built from; empty if no reading can supply it. */
function readingsFor(fact: string, kind: UnitKind, stages: Set<Stage>): string[] {
  const spec = FACT_SPECS.get(fact)
  if (!spec) return []
  const where = spec.stage ?? (spec.needsStage === 'cabinet' ? (kind === 'cascade' ? 'low' : 'single') : spec.needsStage)
  if (where && !stages.has(where)) return []
  return spec.needs.map((q) => (isStageQuantity(q) && where ? `${where}:${q}` : q))
}

/** Readings that, if measured, would let waiting rules run; ranked by how many rules wait for them. */
export function sharpenWith(
  run: RuleRun,
  present: Set<string>,
  kind: UnitKind,
  stages: Set<Stage>,
  /** Facts the stage data cannot support whatever is measured (e.g. no charge, volume or reference). */
  cannotSupply: ReadonlySet<string> = new Set(),
): WaitingReading[] {
  const counts = new Map<string, number>()
  for (const { missing } of run.waiting) {
    const needed = new Set(missing.flatMap((f) => readingsFor(f, kind, stages)).filter((k) => !present.has(k)))
    // A rule waiting on something no reading can supply (e.g. nameplate charge) does not count.
    const unsuppliable = missing.some((f) => cannotSupply.has(f) || readingsFor(f, kind, stages).length === 0)
    if (unsuppliable) continue
    for (const key of needed) counts.set(key, (counts.get(key) ?? 0) + 1)
  }
  return [...counts.entries()]
    .sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))
    .slice(0, 10)
    .map(([key, rulesWaiting]) => {
      const [stage, quantity] = key.includes(':') ? (key.split(':') as [Stage, Quantity]) : [undefined, key as Quantity]
      return stage ? { quantity, stage, rulesWaiting } : { quantity, rulesWaiting }
    })
}
