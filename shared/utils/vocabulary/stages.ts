import type { Stage } from '#shared/types/diagnosis'
import type { WordForm, WordLabel } from './words'

/** A refrigerant circuit: the high and low stage of a cascade, or the one circuit of a single-stage unit. */
export const STAGE_WORDS: Readonly<Record<Stage, WordLabel>> = {
  high: { short: 'High', long: 'High stage' },
  low: { short: 'Low', long: 'Low stage' },
  single: { short: 'Single', long: 'Single stage' },
}

/** "High stage", or "High" in the short form. */
export function stageLabel(stage: Stage, form: WordForm = 'long'): string {
  return STAGE_WORDS[stage]?.[form] ?? String(stage)
}

/** Several stages in words: "High stage and Low stage". */
export function stageList(stages: readonly Stage[]): string {
  const labels = stages.map((s) => stageLabel(s))
  return labels.length < 2 ? (labels[0] ?? '') : `${labels.slice(0, -1).join(', ')} and ${labels.at(-1)}`
}
