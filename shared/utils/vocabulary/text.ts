// Free text written by code (warnings of the diagnosis, for instance) may still name a reading by
// its API word ("low:suctionPressure", "cabinetTemperature"). Before such text reaches a person,
// those words are put in the vocabulary's words.
import { QUANTITIES, STAGES, type Quantity, type Stage } from '#shared/types/diagnosis'
import { quantityLabel } from './quantities'
import { stageLabel } from './stages'

const QUANTITY_PATTERN = QUANTITIES.join('|')
const STAGED = new RegExp(`\\b(${STAGES.join('|')})[:.](${QUANTITY_PATTERN})\\b`, 'g')
const BARE = new RegExp(`\\b(${QUANTITY_PATTERN})\\b`, 'g')

const lower = (s: string) => s[0]!.toLowerCase() + s.slice(1)

/** The text with every reading word of the API replaced by its label ("low:suctionPressure" → "Low stage suction pressure"). */
export function inPlainWords(text: string): string {
  return text
    .replace(STAGED, (_, stage: Stage, quantity: Quantity) => `${stageLabel(stage)} ${lower(quantityLabel(quantity))}`)
    .replace(BARE, (_: string, word: Quantity, offset: number) => (offset === 0 ? quantityLabel(word) : lower(quantityLabel(word))))
}
