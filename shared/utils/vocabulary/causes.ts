import type { Stage } from '#shared/types/diagnosis'
import { stageLabel } from './stages'
import { labelOf, type WordEntry, type WordForm } from './words'

/**
 * Fault causes. Adding a cause word takes one entry in the word list (shared/types/diagnosis.ts);
 * without an entry here it reads as the title its knowledge base stores, never as the slug.
 */
export const CAUSE_WORDS: Readonly<Record<string, WordEntry>> = {
  'refrigerant-leak': { short: 'Refrigerant leak', long: 'Refrigerant leak (undercharge)' },
  overcharge: { short: 'Overcharge', long: 'Overcharge' },
  restriction: { short: 'Restriction', long: 'Restriction (filter-drier, strainer or capillary)' },
  'moisture-freeze': { short: 'Moisture freeze', long: 'Moisture freezing at the capillary' },
  'oil-return-blocked': { short: 'Oil return blocked', long: 'Oil return blocked (separator return or wax in the low stage)' },
  'oil-logging': { short: 'Oil logging', long: 'Oil logging in the evaporator' },
  'non-condensables': { short: 'Non-condensables', long: 'Non-condensable gas (air or nitrogen) in the circuit' },
  'condenser-airflow': { short: 'Condenser airflow', long: 'Condenser airflow problem (fouled coil, failed fan, recirculation)' },
  'evaporator-airflow': { short: 'Evaporator airflow', long: 'Evaporator airflow or heat-transfer problem (ice, stopped fan)' },
  'compressor-inefficient': { short: 'Compressor inefficient', long: 'Compressor inefficient (worn valves, internal bypass)' },
  'compressor-electrical': { short: 'Compressor electrical', long: 'Compressor electrical fault (start components, overload, windings, supply)' },
  'wrong-refrigerant': { short: 'Wrong refrigerant', long: 'Wrong or mixed refrigerant' },
  'high-heat-load': { short: 'High heat load', long: 'High heat load (door, gasket, warm product, hot room)' },
  'control-sensor-fault': { short: 'Control or sensor', long: 'Control or sensor fault' },
  other: { short: 'Something else', long: 'Something else' },
}

/** "Refrigerant leak (undercharge)"; `title` is the knowledge base's title for a word without an entry. */
export function causeLabel(cause: string, options: { form?: WordForm; title?: string | null } = {}): string {
  return labelOf(CAUSE_WORDS[cause], cause, options.form ?? 'long', options.title)
}

/** A cause on a stage in words: "Refrigerant leak · Low stage" (short form), "Something else" without a stage. */
export function hypothesisLabel(h: { cause: string; stage?: Stage | null }, options: { form?: WordForm; title?: string | null } = {}): string {
  const cause = causeLabel(h.cause, { form: options.form ?? 'short', title: options.title })
  return h.stage ? `${cause} · ${stageLabel(h.stage)}` : cause
}
