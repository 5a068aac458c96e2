// Names of input fields in words, for messages that point at one field of a form or request
// ("Refrigerant added or recovered, line 2: grams must be a number"). Keys are the API's field names.
import { humanise } from './words'

interface FieldWord {
  /** The field itself ("Refrigerant added or recovered"). */
  label: string
  /** One element of a list field ("line"), numbered from 1 in messages. */
  item?: string
}

/** Field names of the API with their words; a field without an entry reads as a phrase made from its name. */
export const FIELD_WORDS: Readonly<Record<string, FieldWord>> = {
  unitId: { label: 'Unit' },
  complaint: { label: 'Complaint' },
  symptoms: { label: 'Symptoms', item: 'symptom' },
  readings: { label: '', item: 'reading' },
  quantity: { label: 'quantity' },
  stage: { label: 'stage' },
  value: { label: 'value' },
  unit: { label: 'measurement unit' },
  test: { label: 'test' },
  outcome: { label: 'outcome' },
  testResults: { label: '', item: 'test result' },
  text: { label: 'text' },
  confirmedCauses: { label: '', item: 'confirmed cause' },
  cause: { label: 'cause' },
  workDone: { label: 'Work done' },
  parts: { label: 'Parts', item: 'part' },
  refrigerantTransactions: { label: 'Refrigerant added or recovered', item: 'line' },
  refrigerant: { label: 'refrigerant' },
  grams: { label: 'grams' },
  direction: { label: 'added or recovered' },
  cylinder: { label: 'cylinder' },
  unitStateAtDeparture: { label: 'Unit state at departure' },
  followUp: { label: 'Follow-up' },
  version: { label: 'case version' },
  stages: { label: '', item: 'stage' },
  chargeG: { label: 'charge' },
  volumeL: { label: 'volume' },
  referenceStandingPressureKpa: { label: 'reference standing pressure' },
  referenceAmbientC: { label: 'ambient at the reference pressure' },
  ratedCurrentA: { label: 'rated current' },
  designPressureKpa: { label: 'design pressure' },
  meteringDevice: { label: 'metering device' },
  designCabinetC: { label: 'Design cabinet temperature' },
  designCascadeHxC: { label: 'Design cascade heat exchanger temperature' },
  siteId: { label: 'Site' },
  customerId: { label: 'Customer' },
  equipmentClass: { label: 'Type of equipment' },
  serial: { label: 'Serial number' },
  altitudeM: { label: 'Altitude' },
  ambientC: { label: 'Ambient temperature' },
  pressureKpa: { label: 'Pressure' },
  temperatureC: { label: 'Temperature' },
  designation: { label: 'Refrigerant' },
  email: { label: 'E-mail' },
  password: { label: 'Password' },
  role: { label: 'Role' },
  name: { label: 'Name' },
  to: { label: 'Send to' },
  receivesReports: { label: 'Receives reports' },
  _: { label: '' },
}

const wordOf = (key: string): FieldWord => FIELD_WORDS[key] ?? { label: humanise(key).toLowerCase() }
const capitalise = (s: string) => (s ? s[0]!.toUpperCase() + s.slice(1) : s)
// "Grams must …" becomes "grams must …" after a colon; "R404A …" or "E-mail …" keep their capitals.
const lowerFirst = (s: string) => (/^[A-Z][a-z]+\b(?!-)/.test(s) ? s[0]!.toLowerCase() + s.slice(1) : s)

/** The words of a field path, outermost first: ["refrigerantTransactions", 1, "grams"] → ["Refrigerant added or recovered", "line 2", "grams"]. */
function fieldWords(path: readonly PropertyKey[]): string[] {
  const words: string[] = []
  let list: FieldWord | undefined
  for (const segment of path) {
    if (typeof segment === 'number') {
      words.push(`${list?.item ?? 'item'} ${segment + 1}`)
      continue
    }
    list = wordOf(String(segment))
    if (list.label) words.push(list.label)
  }
  return words
}

/** A field path in words: ["refrigerantTransactions", 1, "grams"] → "Refrigerant added or recovered, line 2, grams". */
export function fieldName(path: readonly PropertyKey[]): string {
  return capitalise(fieldWords(path).join(', '))
}

/**
 * A message about one field that names the field in words: "Refrigerant added or recovered, line 2:
 * grams must be a number". The field's own word is not repeated when the message starts with it.
 */
export function fieldMessage(path: readonly PropertyKey[], message: string): string {
  const words = fieldWords(path)
  if (!words.length) return message
  const leaf = words.at(-1)!
  const head = capitalise(words.slice(0, -1).join(', '))
  const namesLeaf = message.toLowerCase().startsWith(leaf.toLowerCase())
  if (!head) return namesLeaf ? message : `${capitalise(leaf)}: ${lowerFirst(message)}`
  return namesLeaf ? `${head}: ${lowerFirst(message)}` : `${head}, ${leaf}: ${lowerFirst(message)}`
}
