/**
 * Runs the findings of a knowledge-base version with json-rules-engine: the engine decides which
 * findings apply to a case; the evidence model (evidence.ts) then weighs them.
 *
 * Speed comes from indexes in front of the engine, built once per version: (1) the facts each finding
 * reads, so a finding with a missing fact never reaches the engine (and never sees `undefined`: the
 * reading it waits for is reported instead); (2) an equality index on the `equal` tests directly under
 * the top-level `all` (symptoms, unit kind, running state); (3) a compiled screen of the whole
 * condition tree with the same operator semantics as the engine, so the engine only confirms the
 * findings that will apply instead of evaluating every rule of the version. A finding whose conditions
 * are nothing but those equality tests (or empty) is settled by the index alone: handing it to the
 * engine would only repeat the comparison.
 */
import { Engine, Rule, type EngineResult } from 'json-rules-engine'
import { isStageQuantity, type Quantity, type Stage, type UnitKind } from '#shared/types/diagnosis'
import { FACT_SPECS } from './fact-vocabulary'
import type { FactValue, Facts } from './fact-sheet'
import type { KnowledgeBase, LeafCondition, NestedCondition, RuleDef } from './knowledge-base'
import { ABSOLUTE_PREFIX, expandRule, placeholderFact, placeholdersOf, type PreparedFinding } from './rule-expansion'

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

const isNumeric = (v: unknown) => Number.parseFloat(String(v)).toString() !== 'NaN'

/** json-rules-engine 7's built-in operators, with their fact validators, plus ours. */
const SCREEN_OPERATORS: Record<string, (fact: unknown, value: unknown) => boolean> = {
  equal: (a, b) => a === b,
  notEqual: (a, b) => a !== b,
  in: (a, b) => Array.isArray(b) && b.indexOf(a) > -1,
  notIn: (a, b) => Array.isArray(b) && b.indexOf(a) === -1,
  lessThan: (a, b) => isNumeric(a) && (a as number) < (b as number),
  lessThanInclusive: (a, b) => isNumeric(a) && (a as number) <= (b as number),
  greaterThan: (a, b) => isNumeric(a) && (a as number) > (b as number),
  greaterThanInclusive: (a, b) => isNumeric(a) && (a as number) >= (b as number),
  ...CUSTOM_OPERATORS,
}

type Screen = (facts: Facts) => boolean

/** Compiles a condition tree into a predicate with the engine's semantics (all/any/not, operators above). */
export function compileScreen(c: NestedCondition): Screen {
  if ('fact' in c) return compileLeaf(c)
  if ('all' in c) {
    const parts = c.all.map(compileScreen)
    return (facts) => parts.every((p) => p(facts))
  }
  if ('any' in c) {
    const parts = c.any.map(compileScreen)
    return (facts) => parts.some((p) => p(facts))
  }
  const inner = compileScreen(c.not)
  return (facts) => !inner(facts)
}

function compileLeaf(leaf: LeafCondition): Screen {
  const op = SCREEN_OPERATORS[leaf.operator]
  if (!op) return () => true
  const { fact, value } = leaf
  return (facts) => op(facts[fact], value)
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

export function createRuleEngine(rules: { conditions: unknown; id: string }[]): { engine: SubsetEngine; compiled: Rule[] } {
  const engine = new SubsetEngine([], { allowUndefinedFacts: true })
  for (const [name, fn] of Object.entries(CUSTOM_OPERATORS)) engine.addOperator(name, fn)
  const compiled = rules.map((r) => {
    const rule = new Rule({ name: r.id, conditions: r.conditions as never, event: { type: 'finding', params: { id: r.id } } })
    engine.addRule(rule)
    return rule
  })
  return { engine, compiled }
}

// ------------------------------------------------------------------ prepared versions

export interface PreparedKnowledgeBase {
  findings: PreparedFinding[]
  byId: Map<string, PreparedFinding>
  engine: SubsetEngine
  compiled: Rule[]
  screens: Screen[]
  /** Findings whose whole condition tree is the equality index's tests: no engine run needed. */
  indexOnly: boolean[]
  source: RuleDef[]
  /** Per-kind structures of the evidence model, built on first use (evidence.ts). */
  models: Map<UnitKind, unknown>
}

const cache = new Map<string, PreparedKnowledgeBase>()
const CACHE_LIMIT = 16

/** One prepared engine per version; an edited draft (new rules array) is prepared again. */
export function prepareKnowledgeBase(kb: Pick<KnowledgeBase, 'version' | 'rules'>): PreparedKnowledgeBase {
  const key = `${kb.version.id}:${kb.version.status}`
  const hit = cache.get(key)
  if (hit && hit.source === kb.rules) return hit
  const findings = kb.rules.flatMap(expandRule)
  const { engine, compiled } = createRuleEngine(findings)
  const prepared: PreparedKnowledgeBase = {
    findings,
    byId: new Map(findings.map((r) => [r.id, r])),
    engine,
    compiled,
    screens: findings.map((r) => compileScreen(r.conditions)),
    indexOnly: findings.map((r) => settledByIndex(r.conditions)),
    source: kb.rules,
    models: new Map(),
  }
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value ?? '')
  cache.set(key, prepared)
  return prepared
}

/** True when a condition tree holds only `equal` tests under nested `all`s: exactly what the equality index checks. */
function settledByIndex(c: NestedCondition): boolean {
  if ('all' in c) return c.all.every((x) => ('fact' in x ? x.operator === 'equal' && !Array.isArray(x.value) : 'all' in x && settledByIndex(x)))
  return false
}

export function clearPreparedCache(): void {
  cache.clear()
}

// ------------------------------------------------------------------ running

export interface FindingRun {
  applied: PreparedFinding[]
  /** Findings left out because at least one of their facts is missing. */
  waiting: { finding: PreparedFinding; missing: string[] }[]
  /** Findings handed to json-rules-engine. */
  evaluated: number
}

export function missingFacts(finding: PreparedFinding, facts: Facts): string[] {
  return finding.facts.filter((f) => facts[f] === undefined)
}

/** Equality index: an `all` holding `symptom.x equal true` cannot apply while the symptom is false. */
function equalsHold(finding: PreparedFinding, facts: Facts): boolean {
  return finding.requiredEquals.every(([fact, value]) => facts[fact] === value)
}

export async function runFindings(prepared: PreparedKnowledgeBase, facts: Facts): Promise<FindingRun> {
  const selected: Rule[] = []
  const settled = new Set<PreparedFinding>()
  const waiting: FindingRun['waiting'] = []
  // The engine is handed only the facts the selected findings read (every leaf names its fact and
  // compares it with a constant), so it does not copy the whole fact sheet on every run.
  const read: Facts = {}
  prepared.findings.forEach((finding, i) => {
    const missing = missingFacts(finding, facts)
    if (missing.length) waiting.push({ finding, missing })
    else if (!equalsHold(finding, facts)) return
    else if (prepared.indexOnly[i]) settled.add(finding)
    else if ((prepared.screens[i] as Screen)(facts)) {
      selected.push(prepared.compiled[i] as Rule)
      for (const f of finding.facts) read[f] = facts[f] as FactValue
    }
  })
  const result = selected.length ? await prepared.engine.runSubset(read, selected) : { events: [] }
  const confirmed = new Set(result.events.map((e) => String(e.params?.id)))
  // Keep authoring order, whichever path decided a finding.
  const applied = prepared.findings.filter((f) => confirmed.has(f.id) || settled.has(f))
  return { applied, waiting, evaluated: selected.length }
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
export function renderText(template: string, facts: Facts): string {
  let out = template
  for (const name of placeholdersOf(template)) {
    const value = facts[placeholderFact(name)]
    out = out.replaceAll(`{${name}}`, formatFact(name.startsWith(ABSOLUTE_PREFIX) && typeof value === 'number' ? Math.abs(value) : value))
  }
  return out
}

// ------------------------------------------------------------------ what would sharpen

export interface WaitingReading {
  quantity: Quantity
  stage?: Stage
  rulesWaiting: number
}

/** Per unit kind and stage set: fact → reading keys, built once and kept (the fact vocabulary is fixed). */
const readingKeys = new Map<string, Map<string, string[]>>()

/** Reading keys (`quantity` or `stage:quantity`) a fact is built from; empty if no reading can supply it. */
function readingResolver(kind: UnitKind, stages: Set<Stage>): (fact: string) => string[] {
  const shape = `${kind}|${[...stages].sort().join(',')}`
  let memo = readingKeys.get(shape)
  if (!memo) readingKeys.set(shape, (memo = new Map()))
  const known = memo
  return (fact) => {
    const hit = known.get(fact)
    if (hit) return hit
    const spec = FACT_SPECS.get(fact)
    const where = spec?.stage ?? (spec?.needsStage === 'cabinet' ? (kind === 'cascade' ? 'low' : 'single') : spec?.needsStage)
    const keys = !spec || (where && !stages.has(where)) ? [] : spec.needs.map((q) => (isStageQuantity(q) && where ? `${where}:${q}` : q))
    known.set(fact, keys)
    return keys
  }
}

/** Readings that, if measured, would let waiting findings apply; ranked by how many wait for them. */
export function sharpenWith(
  run: FindingRun,
  present: Set<string>,
  kind: UnitKind,
  stages: Set<Stage>,
  /** Facts the stage data cannot support whatever is measured (e.g. no charge, volume or reference). */
  cannotSupply: ReadonlySet<string> = new Set(),
): WaitingReading[] {
  const counts = new Map<string, number>()
  const readingsFor = readingResolver(kind, stages)
  const needed = new Set<string>()
  waiting: for (const { missing } of run.waiting) {
    needed.clear()
    for (const fact of missing) {
      const keys = cannotSupply.has(fact) ? [] : readingsFor(fact)
      if (!keys.length) continue waiting
      for (const key of keys) if (!present.has(key)) needed.add(key)
    }
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
