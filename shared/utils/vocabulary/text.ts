// Free text written by code (warnings of the diagnosis, for instance) may still name a reading by
// its API word ("low:suctionPressure", "cabinetTemperature"). Before such text reaches a person,
// those words are put in the vocabulary's words.
import { CAUSES, QUANTITIES, STAGES, SYMPTOMS, TESTS, UNIT_KINDS, type Quantity, type Stage } from '#shared/types/diagnosis'
import { EQUIPMENT_CLASSES } from '#shared/types/equipment'
import { causeLabel } from './causes'
import { equipmentClassLabel, unitKindLabel } from './equipment'
import { FIELD_WORDS } from './fields'
import { quantityLabel } from './quantities'
import { stageLabel } from './stages'
import { symptomLabel } from './symptoms'
import { testLabel } from './tests'

const QUANTITY_PATTERN = QUANTITIES.join('|')
const STAGED = new RegExp(`\\b(${STAGES.join('|')})[:.](${QUANTITY_PATTERN})\\b`, 'g')
const BARE = new RegExp(`\\b(${QUANTITY_PATTERN})\\b`, 'g')
// Hyphenated words of the API (causes, tests, symptoms, unit kinds, equipment classes); plain
// English words among them ("other", "cascade") are left alone.
const SLUG_LABELS = new Map<string, () => string>([
  ...CAUSES.map((w) => [w, () => causeLabel(w, { form: 'short' })] as const),
  ...TESTS.map((w) => [w, () => testLabel(w)] as const),
  ...SYMPTOMS.map((w) => [w, () => symptomLabel(w)] as const),
  ...UNIT_KINDS.map((w) => [w, () => unitKindLabel(w)] as const),
  ...EQUIPMENT_CLASSES.map((w) => [w, () => equipmentClassLabel(w)] as const),
].filter(([w]) => w.includes('-')))
const SLUGS = new RegExp(`(?<![\\w-])(${[...SLUG_LABELS.keys()].join('|')})(?![\\w-])`, 'g')

const lower = (s: string) => (/^[A-Z][a-z]/.test(s) ? s[0]!.toLowerCase() + s.slice(1) : s)
const atStart = (offset: number, text: string) => offset === 0 || /[.:;!?]\s*$/.test(text.slice(0, offset))

/**
 * The text with every API word in it replaced by its label ("low:suctionPressure" → "Low stage
 * suction pressure", "ult-freezer units" → "ultra-low freezer units"), for text written by code
 * or stored before its words had labels.
 */
export function inPlainWords(text: string): string {
  return text
    .replace(STAGED, (_, stage: Stage, quantity: Quantity) => `${stageLabel(stage)} ${lower(quantityLabel(quantity))}`)
    .replace(BARE, (_: string, word: Quantity, offset: number, all: string) => (atStart(offset, all) ? quantityLabel(word) : lower(quantityLabel(word))))
    .replace(SLUGS, (_: string, word: string, offset: number, all: string) => {
      const label = SLUG_LABELS.get(word)!()
      return atStart(offset, all) ? label : lower(label)
    })
}

/**
 * The label of any single API word a person might meet in written text (a quantity, cause, test,
 * symptom or field name), or undefined for a word that is not one: procedures written for the
 * knowledge base quote such words, and pages show their labels instead.
 */
export function labelOfApiWord(word: string): string | undefined {
  if ((QUANTITIES as readonly string[]).includes(word)) return quantityLabel(word as Quantity)
  if ((CAUSES as readonly string[]).includes(word)) return causeLabel(word)
  if ((TESTS as readonly string[]).includes(word)) return testLabel(word)
  if ((SYMPTOMS as readonly string[]).includes(word)) return symptomLabel(word)
  const field = FIELD_WORDS[word]
  return field?.label ? field.label : undefined
}
