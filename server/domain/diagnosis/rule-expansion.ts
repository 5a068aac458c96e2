/**
 * Stage expansion of findings. `event.params.stage` is a concrete stage (`high`, `low`, `single`) or
 * a role expanded when a version is prepared:
 *   - `each`    → one copy per stage (restricted by the rule's optional `stages`),
 *   - `cabinet` → the stage that cools the cabinet: `low` on a cascade, `single` otherwise,
 *   - `ambient` → the stage that rejects heat to room air: `high` on a cascade, `single` otherwise.
 * `{stage}.x` in fact names, `{stage}` in group names and `{stage.x}` placeholders become the copy's
 * stage; `{@stage}`/`{@Stage}` become words ("low stage", "System").
 */
import { STAGES, type Stage, type UnitKind } from '#shared/types/diagnosis'
import type { LeafCondition, NestedCondition, TopCondition } from './conditions'
import { orderBands, type Bands, type LikelihoodTable } from './likelihood'

/** A finding after stage expansion: what the engine runs and the evidence model reads. */
export interface PreparedFinding {
  /** `name` plus `@stage` for expanded copies; unique within a version. */
  id: string
  name: string
  subject: string
  /** The copy's stage (fact names were resolved for it). */
  stage?: Stage
  /** The stage the likelihood table speaks about; undefined for a finding about the whole unit. */
  about?: Stage
  /** Correlation group: findings of one group read one physical effect and count once. */
  group: string
  conditions: TopCondition
  /** Every fact the finding reads; it runs only when all are present. */
  facts: string[]
  /** `equal` tests at the top level of an `all`: the finding cannot apply unless each holds (equality index). */
  requiredEquals: [string, string | number | boolean][]
  measure?: PreparedMeasure
  /** Reads a pair against the nameplate curve (see knowledge-base.ts). */
  nameplateCurve?: boolean
  likelihoods: LikelihoodTable
  /** Text per band of a graded finding; a single text is stored under `*`. */
  because: Record<string, string>
}

export interface PreparedMeasure {
  fact: string
  uncertainty?: string
  sigma: number
  unit: string
  bands: Bands
}

/** The measured residual of a graded finding, as the knowledge base states it. */
export interface MeasureSource {
  fact: string
  uncertainty?: string
  sigma: number
  unit: string
  bands: Record<string, [number, number]>
}

/** What stage expansion reads of a finding; the knowledge base's validated rules have this shape. */
export interface ExpandableRule {
  name: string
  subject?: string
  stages?: Stage[]
  conditions: TopCondition
  event: {
    params: {
      stage?: Stage | 'each' | 'cabinet' | 'ambient'
      about?: 'stage' | 'unit'
      group?: string
      measure?: MeasureSource
      nameplateCurve?: boolean
      likelihoods: unknown
      because: string | Record<string, string>
    }
  }
}

interface Expansion {
  stage?: Stage
  kind?: UnitKind
}

const ROLE_EXPANSIONS: Record<'cabinet' | 'ambient', Required<Expansion>[]> = {
  cabinet: [
    { stage: 'low', kind: 'cascade' },
    { stage: 'single', kind: 'single-stage' },
  ],
  ambient: [
    { stage: 'high', kind: 'cascade' },
    { stage: 'single', kind: 'single-stage' },
  ],
}

function expansionsOf(rule: ExpandableRule): Expansion[] {
  const stage = rule.event.params.stage
  if (stage === undefined) return [{}]
  if (stage === 'each') return (rule.stages ?? [...STAGES]).map((s) => ({ stage: s }))
  if (stage === 'cabinet' || stage === 'ambient') {
    return ROLE_EXPANSIONS[stage].filter((e) => !rule.stages || rule.stages.includes(e.stage))
  }
  return [{ stage }]
}

const STAGE_WORDS: Record<Stage, [string, string]> = {
  high: ['high stage', 'High stage'],
  low: ['low stage', 'Low stage'],
  single: ['system', 'System'],
}

export function substituteStage(text: string, stage: Stage | undefined): string {
  if (!stage) return text
  return text
    .replaceAll('{stage.', `{${stage}.`)
    .replaceAll('{abs:stage.', `{abs:${stage}.`)
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

function prepareMeasure(m: MeasureSource | undefined, stage: Stage | undefined): PreparedMeasure | undefined {
  if (!m) return undefined
  const out: PreparedMeasure = { fact: substituteStage(m.fact, stage), sigma: m.sigma, unit: m.unit, bands: orderBands(m.bands) }
  if (m.uncertainty) out.uncertainty = substituteStage(m.uncertainty, stage)
  return out
}

/** Expands stage roles into concrete findings; deterministic order (authoring order, then stage order). */
export function expandRule(rule: ExpandableRule): PreparedFinding[] {
  const params = rule.event.params
  return expansionsOf(rule).map(({ stage, kind }) => {
    const resolved = mapLeaves(rule.conditions, (leaf) => ({ ...leaf, fact: substituteStage(leaf.fact, stage) })) as TopCondition
    const conditions: TopCondition = kind ? { all: [{ fact: 'unit.kind', operator: 'equal', value: kind }, resolved] } : resolved
    const measure = prepareMeasure(params.measure, stage)
    const facts = [...new Set([...collectLeaves(conditions).map((l) => l.fact), ...(measure ? [measure.fact] : [])])].sort()
    const id = stage ? `${rule.name}@${stage}` : rule.name
    const texts = typeof params.because === 'string' ? { '*': params.because } : params.because
    const finding: PreparedFinding = {
      id,
      name: rule.name,
      subject: rule.subject ?? 'general',
      group: params.group ? substituteStage(params.group, stage) : id,
      conditions,
      facts,
      requiredEquals: topLevelEquals(conditions),
      likelihoods: params.likelihoods as LikelihoodTable,
      because: Object.fromEntries(Object.entries(texts).map(([k, v]) => [k, substituteStage(v, stage)])),
    }
    if (stage) finding.stage = stage
    const about = params.about ?? (stage ? 'stage' : 'unit')
    if (about === 'stage' && stage) finding.about = stage
    if (measure) finding.measure = measure
    if (params.nameplateCurve) finding.nameplateCurve = true
    return finding
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
/** `{abs:fact}` shows the size of a value whose sign the sentence already says ("8.1 K below"). */
export const ABSOLUTE_PREFIX = 'abs:'

/** Placeholders of a text as written (`abs:low.superheatK`). */
export function placeholdersOf(template: string): string[] {
  return [...template.matchAll(PLACEHOLDER)].map((m) => m[1] ?? '')
}

/** The fact a placeholder reads. */
export function placeholderFact(placeholder: string): string {
  return placeholder.startsWith(ABSOLUTE_PREFIX) ? placeholder.slice(ABSOLUTE_PREFIX.length) : placeholder
}
