import type { Symptom } from '#shared/types/diagnosis'
import { labelOf, type WordEntry, type WordForm } from './words'

/**
 * What the technician sees or is told. A new symptom word needs only its place in the word list;
 * an entry here gives it its own label, else it reads as a phrase made from the word.
 */
export const SYMPTOM_WORDS: Readonly<Partial<Record<Symptom, WordEntry>>> = {
  'not-cooling': { short: 'Not cooling', long: 'Not cooling' },
  'slow-pulldown': { short: 'Slow pull-down', long: 'Slow pull-down' },
  'warming-over-days': { short: 'Warming over days', long: 'Warming over days' },
  'intermittent-cooling': { short: 'On and off', long: 'Cools on and off' },
  'compressor-short-cycling': { short: 'Short-cycling', long: 'Compressor short-cycling' },
  'compressor-not-starting': { short: 'Does not start', long: 'Compressor does not start' },
  'compressor-tripping': { short: 'Trips', long: 'Compressor trips' },
  'frost-on-capillary': { short: 'Frost on capillary', long: 'Frost on a capillary' },
  'oil-at-fitting': { short: 'Oil at fitting', long: 'Oil at a fitting' },
  'line-tap-valve-present': { short: 'Line-tap valve', long: 'Line-tap valve fitted' },
  'recently-serviced': { short: 'Recently serviced', long: 'Recently serviced' },
  'refrigerant-label-mismatch': { short: 'Label mismatch', long: 'Refrigerant label does not match' },
  'noisy-compressor': { short: 'Noisy compressor', long: 'Noisy compressor' },
}

/** "Line-tap valve fitted". */
export function symptomLabel(symptom: string, form: WordForm = 'long'): string {
  return labelOf((SYMPTOM_WORDS as Record<string, WordEntry>)[symptom], symptom, form)
}
