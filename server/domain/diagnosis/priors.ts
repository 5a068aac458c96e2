/**
 * Starting odds. The knowledge base gives default weights per unit kind and, where it knows better,
 * per equipment class. An organisation's own confirmed causes move them only within bounds: the
 * defaults weigh as PRIOR_STRENGTH closed cases, no hypothesis falls below PRIOR_FLOOR of its default
 * share nor rises above PRIOR_CEILING times it, and only confirmations backed by a definitive test or
 * repair count. A short or lopsided history therefore cannot swamp the readings, and a ranking that
 * once pointed the wrong way cannot teach itself to keep doing so.
 */
import type { Cause, Stage, UnitKind } from '#shared/types/diagnosis'
import { EQUIPMENT_CLASSES, type EquipmentClass } from '#shared/types/equipment'
import { equipmentClassLabel } from '#shared/utils/vocabulary'
import type { CauseDef, PriorWeight } from './knowledge-base'
import { hypothesisKey, type Hypothesis } from './hypotheses'

export interface LearnedCount {
  cause: Cause
  stage?: Stage
  count: number
  /** True when the confirmation rests on a definitive test or repair; only those teach the priors. */
  definitive: boolean
}

export interface RankOptions {
  /** Confirmed causes of this organisation's closed cases of the same equipment class. */
  learnedCounts?: LearnedCount[]
  /** Equipment class of the unit (`ult-freezer`, `cold-room`, …); picks class weights and labels the note. */
  equipmentClass?: string
}

/** How many closed cases the default weights are worth. */
export const PRIOR_STRENGTH = 200
/** Share of its default prior every hypothesis keeps whatever the history. */
export const PRIOR_FLOOR = 0.5
/** Largest multiple of its default prior a hypothesis may reach through history. */
export const PRIOR_CEILING = 3

function weightFor(w: PriorWeight, stage: Stage | undefined, stagesInUnit: number): number {
  if (typeof w === 'number') return w / Math.max(1, stagesInUnit)
  return stage ? (w[stage] ?? 0) : 0
}

function isEquipmentClass(s: string | undefined): s is EquipmentClass {
  return s !== undefined && (EQUIPMENT_CLASSES as readonly string[]).includes(s)
}

export function normalise(xs: number[]): number[] {
  const sum = xs.reduce((a, b) => a + b, 0)
  return sum > 0 ? xs.map((x) => x / sum) : xs.map(() => 1 / xs.length)
}

/** Default shares over the hypotheses, each weight times `factors[i]` (0 rules a hypothesis out). */
export function defaultPriors(causes: CauseDef[], hyps: Hypothesis[], kind: UnitKind, equipmentClass?: string, factors: number[] = []): number[] {
  const byCause = new Map(causes.map((c) => [c.slug, c]))
  const stagesOf = (cause: Cause) => hyps.filter((h) => h.cause === cause).length
  const cls = isEquipmentClass(equipmentClass) ? equipmentClass : undefined
  const raw = hyps.map((h, i) => {
    const factor = factors[i] ?? 1
    const def = byCause.get(h.cause)
    if (!def || factor === 0) return 0
    const w = (cls && def.priors.classes?.[cls]) ?? def.priors[kind]
    return Math.max(weightFor(w, h.stage, stagesOf(h.cause)), 1e-4) * factor
  })
  return normalise(raw)
}

export interface Priors {
  values: number[]
  note: string
}

function classWords(kind: UnitKind, equipmentClass?: string): string {
  if (isEquipmentClass(equipmentClass)) return `${equipmentClassLabel(equipmentClass).toLowerCase()} units`
  return kind === 'cascade' ? 'cascade units' : 'single-stage units'
}

export function priorsFor(causes: CauseDef[], kind: UnitKind, hyps: Hypothesis[], options: RankOptions = {}, factors: number[] = []): Priors {
  const base = defaultPriors(causes, hyps, kind, options.equipmentClass, factors)
  const what = classWords(kind, options.equipmentClass)
  const counts = new Map<string, number>()
  let undefinitive = 0
  for (const lc of options.learnedCounts ?? []) {
    if (!(lc.count > 0)) continue
    if (!lc.definitive) {
      undefinitive += lc.count
      continue
    }
    const key = hypothesisKey(lc.cause, lc.cause === 'other' || lc.cause === 'no-refrigeration-fault' ? undefined : lc.stage)
    const i = hyps.findIndex((h) => h.key === key)
    if (i < 0 || factors[i] === 0) continue
    counts.set(key, (counts.get(key) ?? 0) + lc.count)
  }
  const total = [...counts.values()].reduce((a, b) => a + b, 0)
  const setAside = undefinitive ? ` ${undefinitive} confirmation(s) without a definitive test or repair are not counted.` : ''
  if (total === 0) {
    return { values: base, note: `Starting odds: Rimecase's default weights for ${what}; no definitively confirmed causes of this kind of unit to learn from yet.${setAside}` }
  }
  const updated = hyps.map((h, i) => (PRIOR_STRENGTH * (base[i] ?? 0) + (counts.get(h.key) ?? 0)) / (PRIOR_STRENGTH + total))
  return {
    values: clampShares(updated, base),
    note:
      `Starting odds: Rimecase's default weights for ${what}, adjusted by ${total} definitively confirmed cause(s) from your organisation's closed cases of this kind. ` +
      `The defaults weigh as ${PRIOR_STRENGTH} cases, and no cause moves below ${PRIOR_FLOOR * 100} % or above ${PRIOR_CEILING} times its default share, so the readings decide.${setAside}`,
  }
}

/**
 * Keeps every share within [PRIOR_FLOOR, PRIOR_CEILING] times its default while the shares still sum
 * to 1: finds the common scale λ for which Σ clamp(λ·share) = 1 (the sum grows with λ, so bisection).
 */
function clampShares(shares: number[], base: number[]): number[] {
  const clamped = (scale: number) => shares.map((x, i) => Math.min(Math.max(scale * x, PRIOR_FLOOR * (base[i] ?? 0)), PRIOR_CEILING * (base[i] ?? 0)))
  const total = (scale: number) => clamped(scale).reduce((a, b) => a + b, 0)
  let lo = 0
  let hi = 1
  while (total(hi) < 1 && hi < 1e6) hi *= 2
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2
    if (total(mid) < 1) lo = mid
    else hi = mid
  }
  return normalise(clamped(hi))
}
