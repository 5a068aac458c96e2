/**
 * Knowledge-base model: causes, tests and findings, with the zod schemas every source passes
 * (content-src files, the database, an uploaded bundle) before it is stored or used.
 *
 * A finding is a json-rules-engine rule: its conditions say when it applies (the facts it needs are
 * present, the compressor runs, a symptom is reported), and its event carries the likelihood
 * specification: P(finding | hypothesis) for the hypotheses it speaks to, an explicit value for a
 * healthy stage, a default for the causes it does not name, and `other`. Graded findings state, per
 * hypothesis, which band of a measured residual it predicts; the ranking turns the measured value and
 * its uncertainty into a likelihood (likelihood.ts). Stage roles are expanded in rule-expansion.ts.
 */
import { z } from 'zod'
import { CAUSES, STAGES, TESTS, QUANTITIES, isStagelessCause, type Cause } from '#shared/types/diagnosis'
import { causeSchema, meteringDeviceSchema, stageSchema, testSlugSchema, wordEnum } from '#shared/schemas/diagnosis'
import { EQUIPMENT_CLASSES } from '#shared/types/equipment'
import { NUMERIC_OPERATORS, OPERATORS, type ConditionValue, type NestedCondition, type OperatorName, type TopCondition } from './conditions'
import { FACT_SPECS, type FactType } from './fact-vocabulary'
import { collectLeaves, expandRule, placeholderFact, placeholdersOf } from './rule-expansion'
import { checkTable, tableKeyProblems, type LikelihoodTable } from './likelihood'

// ---------------------------------------------------------------- conditions

export { NUMERIC_OPERATORS, RANGE_OPERATORS, OPERATORS, type OperatorName, type ConditionValue, type LeafCondition, type AllCondition, type AnyCondition, type NotCondition, type TopCondition, type NestedCondition } from './conditions'

const operatorSchema = wordEnum('operator', OPERATORS)
const conditionValueSchema = z.union([z.number().finite(), z.string(), z.boolean(), z.array(z.number().finite()), z.array(z.string())])

export const leafConditionSchema = z
  .object({ fact: z.string().min(1), operator: operatorSchema, value: conditionValueSchema })
  .strict()
  .superRefine((leaf, ctx) => checkOperatorValue(leaf, ctx))

export const nestedConditionSchema: z.ZodType<NestedCondition> = z.lazy(() =>
  z.union([leafConditionSchema, topConditionSchema], {
    error: 'A condition is {fact, operator, value} or {all: [...]}, {any: [...]}, {not: {...}}',
  }),
)

/** A finding that needs nothing but its measured fact may have an empty `all`. */
export const topConditionSchema: z.ZodType<TopCondition> = z.lazy(() =>
  z.union(
    [
      z.object({ all: z.array(nestedConditionSchema) }).strict(),
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

/**
 * Starting weights: one per unit kind, and optionally one per equipment class (a cold room meets
 * evaporator-fan faults more often than a lab freezer with a wall-bonded evaporator).
 */
const priorsSchema = z
  .object({
    cascade: priorWeightSchema,
    'single-stage': priorWeightSchema,
    classes: z.partialRecord(wordEnum('equipment class', EQUIPMENT_CLASSES), priorWeightSchema).optional(),
  })
  .strict()
export type CausePriors = z.infer<typeof priorsSchema>

export const causeDefSchema = z
  .object({
    slug: causeSchema,
    title: z.string().min(1),
    /** The cause inside a sentence, lower case ("a leak", "a blockage"): next-test values are written with it. */
    short: z.string().min(1),
    stages: z.array(stageSchema),
    priors: priorsSchema,
    description: z.string().min(1),
  })
  .strict()
  .superRefine((c, ctx) => {
    if (isStagelessCause(c.slug) && c.stages.length) ctx.addIssue({ code: 'custom', path: ['stages'], message: `${c.slug} belongs to no stage; leave the list empty` })
    if (!isStagelessCause(c.slug) && c.stages.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['stages'], message: 'must list at least one stage (high, low, single)' })
    }
  })
export type CauseDef = z.infer<typeof causeDefSchema>

// ---------------------------------------------------------------- likelihood tables

const probability = z
  .number({ error: 'must be a number between 0 and 1' })
  .min(0, { error: 'must be between 0 and 1' })
  .max(1, { error: 'must be between 0 and 1' })

const bandWord = z.string().regex(/^[a-z][a-z-]*$/, 'must be a lower-case band name')
/** A band name, or a mixture of bands with weights summing to 1. */
const bandPredictionSchema = z.union([bandWord, z.record(bandWord, probability)])
const categoricalTableSchema = z.record(z.string(), probability)
const gradedTableSchema = z.record(z.string(), bandPredictionSchema)

const tableKeysChecked = <T extends z.ZodType<LikelihoodTable>>(schema: T) =>
  schema.superRefine((table, ctx) => {
    for (const [path, message] of tableKeyProblems(table)) ctx.addIssue({ code: 'custom', path, message })
  })

// ---------------------------------------------------------------- tests

export const testOutcomeSchema = z
  .object({
    slug: z.string().regex(/^[a-z0-9-]+$/, 'must be lower-case words joined by hyphens'),
    label: z.string().min(1),
    /** The outcome settles the cause by itself (a leak found, a probe found off): the case moves to repair after it. */
    definitive: z.boolean().optional(),
    likelihoods: tableKeysChecked(categoricalTableSchema),
  })
  .strict()

/** Tolerance on Σ_o P(o | hypothesis); authors write two decimals, so a little rounding is accepted. */
const SUM_TOLERANCE = 0.02

export const testDefSchema = z
  .object({
    slug: testSlugSchema,
    title: z.string().min(1),
    minutes: z.number().positive(),
    opensSystem: z.boolean(),
    hotWork: z.boolean(),
    stages: z.array(stageSchema).min(1),
    /**
     * The metering devices a stage must be fed by for the test to apply (the expansion valve check
     * needs a valve, the warm capillary test a capillary). Not proposed on a stage the unit record
     * says is fed otherwise; proposed where the record does not say. Absent: any stage.
     */
    meteringDevices: z.array(meteringDeviceSchema).min(1).optional(),
    /** A reading that gives this test's answer; the test is not proposed once that reading is in. */
    answeredBy: wordEnum('quantity', QUANTITIES).optional(),
    /**
     * Findings (by rule name) that read the same measurement as this test: when one of them applies on
     * the test's stage, the outcome adds nothing new and is not counted again. `bands` maps each outcome
     * to the bands of those findings it agrees with, so a contradiction between the two is pointed out.
     */
    sameMeasurementAs: z
      .object({ findings: z.array(z.string().regex(/^[a-z0-9-]+$/)).min(1), bands: z.record(z.string(), z.array(z.string())).optional() })
      .strict()
      .optional(),
    safetyNotes: z.array(z.string().min(1)),
    outcomes: z.array(testOutcomeSchema).min(2),
    procedure: z.string().min(1),
  })
  .strict()
  .superRefine((t, ctx) => {
    const slugs = t.outcomes.map((o) => o.slug)
    if (new Set(slugs).size !== slugs.length) ctx.addIssue({ code: 'custom', path: ['outcomes'], message: 'outcome slugs must be unique' })
    for (const message of checkTable(t.outcomes.map((o) => o.likelihoods), SUM_TOLERANCE)) ctx.addIssue({ code: 'custom', path: ['outcomes'], message })
  })
export type TestDef = z.infer<typeof testDefSchema>
export type TestOutcomeDef = TestDef['outcomes'][number]

// ---------------------------------------------------------------- findings

export const RULE_STAGE_ROLES = ['each', 'cabinet', 'ambient'] as const
export const RULE_STAGES = [...STAGES, ...RULE_STAGE_ROLES] as const
export type RuleStage = (typeof RULE_STAGES)[number]

const bandEdgesSchema = z.tuple([z.number().finite(), z.number().finite()])

/** The measured residual a graded finding reads, the model's own spread and the bands hypotheses predict. */
export const measureSchema = z
  .object({
    fact: z.string().min(1),
    /** Fact holding the standard uncertainty of the measurement in the same unit (combined in quadrature with `sigma`). */
    uncertainty: z.string().min(1).optional(),
    sigma: z.number().positive(),
    unit: z.string().min(1),
    bands: z.record(bandWord, bandEdgesSchema),
  })
  .strict()
  .superRefine((m, ctx) => {
    const edges = Object.values(m.bands).sort((a, b) => a[0] - b[0])
    if (edges.length < 2) ctx.addIssue({ code: 'custom', path: ['bands'], message: 'needs at least two bands' })
    edges.forEach(([lo, hi], i) => {
      if (!(lo < hi)) ctx.addIssue({ code: 'custom', path: ['bands'], message: `band [${lo}, ${hi}] must have low < high` })
      const next = edges[i + 1]
      if (next && next[0] !== hi) ctx.addIssue({ code: 'custom', path: ['bands'], message: `bands must touch: one ends at ${hi}, the next starts at ${next[0]}` })
    })
  })
export type MeasureSpec = z.infer<typeof measureSchema>

const findingParamsSchema = z
  .object({
    stage: wordEnum('rule stage', RULE_STAGES).optional(),
    /** `stage` (default for staged findings): the finding is about the copy's stage; `unit`: about the unit as a whole. */
    about: z.enum(['stage', 'unit'], { error: 'about must be "stage" or "unit"' }).optional(),
    group: z.string().regex(/^[a-z{}@][a-z{}@-]*$/, 'must be lower-case words, may hold {stage}').optional(),
    measure: measureSchema.optional(),
    /**
     * The finding reads a pair against the nameplate refrigerant's curve. Other graded findings about a
     * stage whose readings fit another refrigerant are worked out with that refrigerant, so under
     * wrong-refrigerant they read as a healthy stage would; these keep their own entry.
     */
    nameplateCurve: z.boolean().optional(),
    likelihoods: z.union([categoricalTableSchema, gradedTableSchema]),
    /** Words a person reads: one text, or one per band of a graded finding. */
    because: z.union([z.string().min(1), z.record(bandWord, z.string().min(1))]),
  })
  .strict()
  .superRefine((p, ctx) => checkFindingTable(p, ctx))
export type FindingParams = z.infer<typeof findingParamsSchema>

export const ruleDefSchema = z
  .object({
    name: z.string().regex(/^[a-z0-9-]+$/, 'must be lower-case words joined by hyphens'),
    subject: z.string().min(1).optional(),
    stages: z.array(stageSchema).min(1).optional(),
    conditions: topConditionSchema,
    event: z.object({ type: z.literal('finding', { error: 'must be "finding"' }), params: findingParamsSchema }).strict(),
  })
  .strict()
  .superRefine((rule, ctx) => checkRuleFacts(rule, ctx))
export type RuleDef = z.infer<typeof ruleDefSchema>

function checkFindingTable(p: { measure?: MeasureSpec; likelihoods: Record<string, unknown>; because: string | Record<string, string> }, ctx: z.RefinementCtx): void {
  const add = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message })
  for (const [path, message] of tableKeyProblems(p.likelihoods as LikelihoodTable)) add(['likelihoods', ...path], message)
  const bands = p.measure ? new Set(Object.keys(p.measure.bands)) : undefined
  for (const [key, value] of Object.entries(p.likelihoods)) {
    if (!bands) {
      if (typeof value !== 'number') add(['likelihoods', key], 'a finding without `measure` takes probabilities (numbers between 0 and 1)')
      continue
    }
    if (typeof value === 'number') {
      add(['likelihoods', key], 'a graded finding takes a band name or a mixture of bands, not a number')
      continue
    }
    const mixture: Record<string, number> = typeof value === 'string' ? { [value]: 1 } : (value as Record<string, number>)
    for (const band of Object.keys(mixture)) {
      if (band !== 'any' && !bands.has(band)) add(['likelihoods', key], `unknown band "${band}"; bands: ${[...bands].join(', ')}, any`)
    }
    const sum = Object.values(mixture).reduce((a, b) => a + b, 0)
    if (Math.abs(sum - 1) > SUM_TOLERANCE) add(['likelihoods', key], `band weights sum to ${sum.toFixed(3)}; they must sum to 1`)
  }
  if (typeof p.because !== 'string') {
    if (!bands) add(['because'], 'per-band texts need a `measure`')
    else for (const band of bands) if (!p.because[band]) add(['because', band], `text for band "${band}" is missing`)
  }
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
  const params = rule.event.params
  if (params.about === 'stage' && params.stage === undefined) report(['event', 'params', 'about'], 'a finding about a stage needs `stage` (a stage or each, cabinet, ambient)')
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
    for (const fact of [prepared.measure?.fact, prepared.measure?.uncertainty]) {
      if (fact === undefined) continue
      const spec = FACT_SPECS.get(fact)
      if (!spec) report(['event', 'params', 'measure'], `unknown fact "${fact}"`)
      else if (spec.type !== 'number') report(['event', 'params', 'measure'], `"${fact}" is ${spec.type}; a measure needs a number fact`)
    }
    for (const text of Object.values(prepared.because)) {
      for (const ph of placeholdersOf(text)) if (!FACT_SPECS.has(placeholderFact(ph))) report(['event', 'params', 'because'], `unknown placeholder {${ph}}`)
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

/** Every cause and test word must be defined once; a table key must name a cause×stage that exists. */
export function checkCrossReferences(kb: { causes: CauseDef[]; tests: TestDef[]; rules: RuleDef[] }, ctx: z.RefinementCtx): void {
  requireEachOnce(kb.causes.map((c) => c.slug), CAUSES, 'causes', ctx)
  requireEachOnce(kb.tests.map((t) => t.slug), TESTS, 'tests', ctx)
  const causeStages = new Map<Cause, readonly string[]>(kb.causes.map((c) => [c.slug, c.stages]))
  const names = new Set<string>()
  kb.rules.forEach((rule, i) => {
    if (names.has(rule.name)) ctx.addIssue({ code: 'custom', path: ['rules', i, 'name'], message: `duplicate rule name "${rule.name}"` })
    names.add(rule.name)
    for (const key of Object.keys(rule.event.params.likelihoods)) {
      const problem = keyStageProblem(key, causeStages)
      if (problem) ctx.addIssue({ code: 'custom', path: ['rules', i, 'event', 'params', 'likelihoods', key], message: problem })
    }
  })
  kb.tests.forEach((t, i) => {
    t.outcomes.forEach((o, j) => {
      for (const key of Object.keys(o.likelihoods)) {
        const problem = keyStageProblem(key, causeStages)
        if (problem) ctx.addIssue({ code: 'custom', path: ['tests', i, 'outcomes', j, 'likelihoods', key], message: problem })
      }
    })
  })
}

function keyStageProblem(key: string, causeStages: Map<Cause, readonly string[]>): string | undefined {
  const [cause, stage] = key.split('@') as [Cause, string | undefined]
  if (!stage || !(STAGES as readonly string[]).includes(stage)) return undefined
  const stages = causeStages.get(cause) ?? []
  return stages.includes(stage) ? undefined : `cause ${cause} has no ${stage} stage (its stages: ${stages.join(', ') || 'none'})`
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

