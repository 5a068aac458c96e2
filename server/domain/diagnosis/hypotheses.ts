/**
 * The hypotheses of one unit kind under a single-fault assumption: every cause at every stage it can
 * occupy, `other` (what the knowledge base does not cover) and `no-refrigeration-fault` (the healthy
 * state). Their order is fixed per knowledge base and kind, so likelihood matrices can be built once.
 */
import { isStagelessCause, type Cause, type Stage, type StageConfig, type UnitKind } from '#shared/types/diagnosis'
import { STAGES_OF_KIND } from '#shared/schemas/diagnosis'
import type { CauseDef } from './knowledge-base'

export interface Hypothesis {
  key: string
  cause: Cause
  stage?: Stage
}

export function hypothesisKey(cause: Cause, stage?: Stage): string {
  return stage ? `${cause}@${stage}` : cause
}

export function hypothesesFor(causes: Pick<CauseDef, 'slug' | 'stages'>[], kind: UnitKind): Hypothesis[] {
  const unitStages = STAGES_OF_KIND[kind]
  return causes.flatMap((c): Hypothesis[] => {
    if (isStagelessCause(c.slug)) return [{ key: c.slug, cause: c.slug }]
    return c.stages.filter((s) => unitStages.includes(s)).map((stage) => ({ key: hypothesisKey(c.slug, stage), cause: c.slug, stage }))
  })
}

const EXPANSION_VALVE_CAUSES: readonly Cause[] = ['expansion-valve-underfeeding', 'expansion-valve-overfeeding']
/**
 * Default weights of expansion-valve causes are spread over all units of a class, most of them
 * capillary-fed (roughly one stage in four has a valve); on a stage the record says has one they are
 * this many times as likely (common practice, no source).
 */
export const KNOWN_VALVE_FACTOR = 4

/** Prior factor the unit record sets: 0 for a valve fault on a capillary-fed stage, more on a stage known to have a valve. */
export function unitRecordFactor(h: Hypothesis, stages: StageConfig[]): number {
  if (!h.stage || !EXPANSION_VALVE_CAUSES.includes(h.cause)) return 1
  const device = stages.find((s) => s.stage === h.stage)?.meteringDevice
  return device === 'capillary' ? 0 : device === 'expansion-valve' ? KNOWN_VALVE_FACTOR : 1
}
