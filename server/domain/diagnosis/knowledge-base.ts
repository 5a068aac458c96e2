/**
 * Knowledge-base model: causes, tests and evidence rules, with zod schemas that every source
 * (content-src files, the database, an admin upload) passes before it is stored or used.
 *
 * Stage addressing of rules (see content-src/README.md): `event.params.stage` is a concrete stage
 * (`high`, `low`, `single`) or a role that is expanded when a version is prepared:
 *   - `each`    → one copy per stage (restricted by the rule's optional `stages`),
 *   - `cabinet` → the stage that cools the cabinet: `low` on a cascade, `single` otherwise,
 *   - `ambient` → the stage that rejects heat to room air: `high` on a cascade, `single` otherwise.
 * `{stage}.x` in fact names and `{stage.x}` placeholders in `because` become the copy's stage (`low.x`);
 * `{@stage}`/`{@Stage}` become words ("low stage", "System").
 */
import { z } from 'zod'
import { CAUSES, STAGES, TESTS, type Cause, type Stage, type UnitKind } from '#shared/types/diagnosis'
import { causeSchema, stageSchema, testSlugSchema, wordEnum } from '#shared/schemas/diagnosis'
import { FACT_SPECS, type FactType } from './fact-vocabulary'

// ---------------------------------------------------------------- conditions

export const NUMERIC_OPERATORS = ['lessThan', 'lessThanInclusive', 'greaterThan', 'greaterThanInclusive'] as const
export const RANGE_OPERATORS = ['between', 'outside', 'withinPercent', 'outsidePercent'] as const
export const OPERATORS = ['equal', 'notEqual', 'in', 'notIn', ...NUMERIC_OPERATORS, ...RANGE_OPERATORS] as const
export type OperatorName = (typeof OPERATORS)[number]

export type ConditionValue = number | string | boolean | number[] | string[]

export interface LeafCondition {
  fact: string
  operator: OperatorName
  value: ConditionValue
}
export interface AllCondition {
  all: NestedCondition[]
}
export interface AnyCondition {
  any: NestedCondition[]
}
export interface NotCondition {
  not: NestedCondition
}
export type TopCondition = AllCondition | AnyCondition | NotCondition
export type NestedCondition = LeafCondition | TopCondition

const operatorSchema = wordEnum('operator', OPERATORS)
const conditionValueSchema = z.union([
  z.number().finite(),
  z.string(),
  z.boolean(),
  z.array(z.number().finite()),
  z.array(z.string()),
])

export const leafConditionSchema = z
  .object({ fact: z.string().min(1), operator: operatorSchema, value: conditionValueSchema })
  .strict()
  .superRefine((leaf, ctx) => checkOperatorValue(leaf, ctx))

export const nestedConditionSchema: z.ZodType<NestedCondition> = z.lazy(() =>
  z.union([leafConditionSchema, topConditionSchema], {
    error: 'A condition is {fact, operator, value} or {all: [...]}, {any: [...]}, {not: {...}}',
  }),
)

export const topConditionSchema: z.ZodType<TopCondition> = z.lazy(() =>
  z.union(
    [
      z.object({ all: z.array(nestedConditionSchema).min(1) }).strict(),
      z.object({ any: z.array(nestedConditionSchema).min(1) }).strict(),
      z.object({ not: nestedConditionSchema }).strict(),
    ],
    { error: 'Conditions must be exactly one of {all: [...]}, {any: [...]}, {not: {...}}' },
  ),
)

function isNumberPair(v: ConditionValue): v is [number, number] {
  return Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === 'number')
}

/** Operator/value shape: caught at import so that a rule never meets a value it cannot compare. */
function checkOperatorValue(leaf: { operator: OperatorName; value: ConditionValue }, ctx: z.RefinementCtx): void {
  const { operator, value } = leaf
  const fail = (message: string) => ctx.addIssue({ code: 'custom', path: ['value'], message })
  if ((NUMERIC_OPERATORS as readonly string[]).includes(operator) && typeof value !== 'number') {
    fail(`${operator} needs a number`)
  } else if (operator === 'between' || operator === 'outside') {
    if (!isNumberPair(value) || value[0] > value[1]) fail(`${operator} needs [low, high] with low <= high`)
  } else if (operator === 'withinPercent' || operator === 'outsidePercent') {
    if (!isNumberPair(value) || value[1] <= 0) fail(`${operator} needs [target, percent] with percent > 0`)
  } else if ((operator === 'in' || operator === 'notIn') && !Array.isArray(value)) {
    fail(`${operator} needs an array`)
  } else if ((operator === 'equal' || operator === 'notEqual') && Array.isArray(value)) {
    fail(`${operator} needs a single value`)
  }
}

// ---------------------------------------------------------------- causes

const priorWeightSchema = z.union([
  z.number().nonnegative(),
  z.object({ high: z.number().nonnegative().optional(), low: z.number().nonnegative().optional(), single: z.number().nonnegative().optional() }).strict(),
])
export type PriorWeight = z.infer<typeof priorWeightSchema>

export const causeDefSchema = z
  .object({
    slug: causeSchema,
    title: z.string().min(1),
    stages: z.array(stageSchema),
    priors: z.object({ cascade: priorWeightSchema, 'single-stage': priorWeightSchema }).strict(),
    description: z.string().min(1),
  })
  .strict()
  .superRefine((c, ctx) => {
    if (c.slug !== 'other' && c.stages.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['stages'], message: 'must list at least one stage (high, low, single)' })
    }
  })
export type CauseDef = z.infer<typeof causeDefSchema>

// ---------------------------------------------------------------- tests

const probability = z
  .number({ error: 'must be a number between 0 and 1' })
  .min(0, { error: 'must be between 0 and 1' })
  .max(1, { error: 'must be between 0 and 1' })

const likelihoodsSchema = z
  .record(z.string(), probability)
  .superRefine((l, ctx) => {
    for (const key of Object.keys(l)) {
      if (!(CAUSES as readonly string[]).includes(key)) {
        ctx.addIssue({ code: 'custom', path: [key], message: `Unknown cause "${key}"; allowed: ${CAUSES.join(', ')}` })
      }
    }
    if (l.other === undefined) ctx.addIssue({ code: 'custom', path: ['other'], message: 'is required (it also stands for causes not listed)' })
  })

export const testOutcomeSchema = z
  .object({ slug: z.string().regex(/^[a-z0-9-]+$/, 'must be lower-case words joined by hyphens'), label: z.string().min(1), likelihoods: likelihoodsSchema })
  .strict()

/** Tolerance on Σ_o P(o | cause); authors write two decimals, so a little rounding is accepted. */
const SUM_TOLERANCE = 0.02

export const testDefSchema = z
  .object({
    slug: testSlugSchema,
    title: z.string().min(1),
    minutes: z.number().positive(),
    opensSystem: z.boolean(),
    hotWork: z.boolean(),
    stages: z.array(stageSchema).min(1),
    safetyNotes: z.array(z.string().min(1)),
    outcomes: z.array(testOutcomeSchema).min(2),
    procedure: z.string().min(1),
  })
  .strict()
  .superRefine((t, ctx) => {
    const slugs = t.outcomes.map((o) => o.slug)
    if (new Set(slugs).size !== slugs.length) ctx.addIssue({ code: 'custom', path: ['outcomes'], message: 'outcome slugs must be unique' })
    for (const cause of CAUSES) {
      const sum = t.outcomes.reduce((acc, o) => acc + outcomeLikelihood(o.likelihoods, cause), 0)
      if (Math.abs(sum - 1) > SUM_TOLERANCE) {
        ctx.addIssue({
          code: 'custom',
          path: ['outcomes'],
          message: `likelihoods of ${cause} sum to ${sum.toFixed(3)} over the outcomes; they must sum to 1`,
        })
      }
    }
  })
export type TestDef = z.infer<typeof testDefSchema>
export type TestOutcomeDef = TestDef['outcomes'][number]

/** A cause a test outcome does not mention behaves like `other`: the test says nothing about it. */
export function outcomeLikelihood(likelihoods: Record<string, number>, cause: Cause): number {
  return likelihoods[cause] ?? likelihoods.other ?? 0
}

// ---------------------------------------------------------------- rules

export const RULE_STAGE_ROLES = ['each', 'cabinet', 'ambient'] as const
export const RULE_STAGES = [...STAGES, ...RULE_STAGE_ROLES] as const
export type RuleStage = (typeof RULE_STAGES)[number]

export const ruleDefSchema = z
  .object({
    name: z.string().regex(/^[a-z0-9-]+$/, 'must be lower-case words joined by hyphens'),
    subject: z.string().min(1).optional(),
    stages: z.array(stageSchema).min(1).optional(),
    conditions: topConditionSchema,
    event: z
      .object({
        type: z.literal('evidence', { error: 'must be "evidence"' }),
        params: z
          .object({
            cause: causeSchema,
            stage: wordEnum('rule stage', RULE_STAGES).optional(),
            likelihoodRatio: z.number({ error: 'must be a number greater than 0' }).gt(0, { error: 'must be greater than 0' }),
            because: z.string().min(1),
          })
          .strict(),
      })
      .strict(),
  })
  .strict()
  .superRefine((rule, ctx) => checkRuleFacts(rule, ctx))
export type RuleDef = z.infer<typeof ruleDefSchema>

/** A rule after stage expansion: what the engine runs and the ranking reads. */
export interface PreparedRule {
  /** `name` plus `@stage` for expanded copies; unique within a version. */
  id: string
  name: string
  subject: string
  cause: Cause
  stage?: Stage
  likelihoodRatio: number
  because: string
  conditions: TopCondition
  /** Every fact the conditions read; the rule runs only when all are present. */
  facts: string[]
  /** `equal` tests at the top level of an `all`: the rule cannot fire unless each holds (equality index). */
  requiredEquals: [string, string | number | boolean][]
}

interface Expansion {
  stage?: Stage
  kind?: UnitKind
}

const ROLE_EXPANSIONS: Record<'cabinet' | 'ambient', Expansion[]> = {
  cabinet: [
    { stage: 'low', kind: 'cascade' },
    { stage: 'single', kind: 'single-stage' },
  ],
  ambient: [
    { stage: 'high', kind: 'cascade' },
    { stage: 'single', kind: 'single-stage' },
  ],
}

function expansionsOf(rule: RuleDef): Expansion[] {
  const stage = rule.event.params.stage
  if (rule.event.params.cause === 'other' && stage === undefined) return [{}]
  if (stage === undefined || stage === 'each') return (rule.stages ?? [...STAGES]).map((s) => ({ stage: s }))
  if (stage === 'cabinet' || stage === 'ambient') {
    return ROLE_EXPANSIONS[stage].filter((e) => !rule.stages || (e.stage && rule.stages.includes(e.stage)))
  }
  return [{ stage }]
}

const STAGE_WORDS: Record<Stage, [string, string]> = {
  high: ['high stage', 'High stage'],
  low: ['low stage', 'Low stage'],
  single: ['system', 'System'],
}

function substituteStage(text: string, stage: Stage | undefined): string {
  if (!stage) return text
  return text
    .replaceAll('{stage.', `{${stage}.`)
    .replaceAll('{stage}', stage)
    .replaceAll('{@stage}', STAGE_WORDS[stage][0])
    .replaceAll('{@Stage}', STAGE_WORDS[stage][1])
}

function mapLeaves(c: NestedCondition, f: (leaf: LeafCondition) => LeafCondition): NestedCondition {
  if ('fact' in c) return f(c)
  if ('all' in c) return { all: c.all.map((x) => mapLeaves(x, f)) }
  if ('any' in c) return { any: c.any.map((x) => mapLeaves(x, f)) }
  return { not: mapLeaves(c.not, f) }
}

export function collectLeaves(c: NestedCondition, out: LeafCondition[] = []): LeafCondition[] {
  if ('fact' in c) out.push(c)
  else if ('all' in c) c.all.forEach((x) => collectLeaves(x, out))
  else if ('any' in c) c.any.forEach((x) => collectLeaves(x, out))
  else collectLeaves(c.not, out)
  return out
}

/** Expands stage roles into concrete rules; deterministic order (authoring order, then stage order). */
export function expandRule(rule: RuleDef): PreparedRule[] {
  return expansionsOf(rule).map(({ stage, kind }) => {
    const resolved = mapLeaves(rule.conditions, (leaf) => ({ ...leaf, fact: substituteStage(leaf.fact, stage) })) as TopCondition
    const conditions: TopCondition = kind
      ? { all: [{ fact: 'unit.kind', operator: 'equal', value: kind }, resolved] }
      : resolved
    const facts = [...new Set(collectLeaves(conditions).map((l) => l.fact))].sort()
    return {
      requiredEquals: topLevelEquals(conditions),
      id: stage ? `${rule.name}@${stage}` : rule.name,
      name: rule.name,
      subject: rule.subject ?? 'general',
      cause: rule.event.params.cause,
      stage,
      likelihoodRatio: rule.event.params.likelihoodRatio,
      because: substituteStage(rule.event.params.because, stage),
      conditions,
      facts,
    }
  })
}

/** Equality tests every `all` on the path from the root must pass; `any`/`not` branches are left out. */
function topLevelEquals(c: NestedCondition, out: [string, string | number | boolean][] = []): [string, string | number | boolean][] {
  if ('all' in c) {
    for (const x of c.all) {
      if ('fact' in x && x.operator === 'equal' && !Array.isArray(x.value)) out.push([x.fact, x.value])
      else if ('all' in x) topLevelEquals(x, out)
    }
  }
  return out
}

const PLACEHOLDER = /\{([^{}]+)\}/g

export function placeholdersOf(template: string): string[] {
  return [...template.matchAll(PLACEHOLDER)].map((m) => m[1] ?? '')
}

const OPERATOR_FACT_TYPES: Partial<Record<OperatorName, FactType>> = {
  lessThan: 'number',
  lessThanInclusive: 'number',
  greaterThan: 'number',
  greaterThanInclusive: 'number',
  between: 'number',
  outside: 'number',
  withinPercent: 'number',
  outsidePercent: 'number',
}

/** Fact names, fact types and `because` placeholders are checked on every stage copy of the rule. */
function checkRuleFacts(rule: RuleDef, ctx: z.RefinementCtx): void {
  const reported = new Set<string>()
  const report = (path: (string | number)[], message: string) => {
    if (reported.has(message)) return
    reported.add(message)
    ctx.addIssue({ code: 'custom', path, message })
  }
  for (const prepared of expandRule(rule)) {
    for (const leaf of collectLeaves(prepared.conditions)) {
      const spec = FACT_SPECS.get(leaf.fact)
      if (!spec) {
        report(['conditions'], `unknown fact "${leaf.fact}"`)
        continue
      }
      const wanted = OPERATOR_FACT_TYPES[leaf.operator]
      if (wanted && spec.type !== wanted) report(['conditions'], `${leaf.operator} needs a number fact; "${leaf.fact}" is ${spec.type}`)
      if (!wanted && !Array.isArray(leaf.value) && spec.type !== typeof leaf.value) {
        report(['conditions'], `"${leaf.fact}" is ${spec.type} but is compared with ${JSON.stringify(leaf.value)}`)
      }
    }
    for (const ph of placeholdersOf(prepared.because)) {
      if (!FACT_SPECS.has(ph)) report(['event', 'params', 'because'], `unknown placeholder {${ph}}`)
    }
  }
}

// ---------------------------------------------------------------- knowledge base

export const knowledgeBaseSourceSchema = z
  .object({
    causes: z.array(causeDefSchema),
    tests: z.array(testDefSchema),
    rules: z.array(ruleDefSchema),
  })
  .strict()
  .superRefine((kb, ctx) => checkCrossReferences(kb, ctx))
export type KnowledgeBaseSource = z.infer<typeof knowledgeBaseSourceSchema>

export const knowledgeBaseVersionSchema = z
  .object({
    id: z.union([z.string().min(1), z.number().int()]),
    label: z.string().min(1),
    status: z.enum(['draft', 'published']),
  })
  .strict()
export type KnowledgeBaseVersion = z.infer<typeof knowledgeBaseVersionSchema>

export interface KnowledgeBase extends KnowledgeBaseSource {
  version: KnowledgeBaseVersion
}

/** Every contract cause and test must be defined once; every rule must point at a cause×stage that exists. */
function checkCrossReferences(kb: { causes: CauseDef[]; tests: TestDef[]; rules: RuleDef[] }, ctx: z.RefinementCtx): void {
  requireEachOnce(kb.causes.map((c) => c.slug), CAUSES, 'causes', ctx)
  requireEachOnce(kb.tests.map((t) => t.slug), TESTS, 'tests', ctx)
  const causeStages = new Map(kb.causes.map((c) => [c.slug, c.stages]))
  const names = new Set<string>()
  kb.rules.forEach((rule, i) => {
    if (names.has(rule.name)) ctx.addIssue({ code: 'custom', path: ['rules', i, 'name'], message: `duplicate rule name "${rule.name}"` })
    names.add(rule.name)
    for (const p of expandRule(rule)) {
      if (p.cause === 'other' || !p.stage) continue
      if (!(causeStages.get(p.cause) ?? []).includes(p.stage)) {
        ctx.addIssue({
          code: 'custom',
          path: ['rules', i, 'event', 'params', 'stage'],
          message: `cause ${p.cause} has no ${p.stage} stage (its stages: ${(causeStages.get(p.cause) ?? []).join(', ')})`,
        })
      }
    }
  })
}

function requireEachOnce(found: string[], words: readonly string[], field: string, ctx: z.RefinementCtx): void {
  for (const w of words) {
    const count = found.filter((f) => f === w).length
    if (count !== 1) ctx.addIssue({ code: 'custom', path: [field], message: count ? `"${w}" is defined ${count} times` : `"${w}" is missing` })
  }
}

export function createKnowledgeBase(source: unknown, version: KnowledgeBaseVersion): KnowledgeBase {
  const parsed = knowledgeBaseSourceSchema.parse(source)
  return { ...parsed, version: knowledgeBaseVersionSchema.parse(version) }
}
