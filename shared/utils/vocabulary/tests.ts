import { labelOf, type WordEntry, type WordForm } from './words'

/** A diagnostic test and the words of its outcomes. */
export interface TestWordEntry extends WordEntry {
  outcomes?: Readonly<Record<string, WordEntry>>
}

/**
 * Diagnostic tests and their outcomes. As with causes, a new test word needs only its place in the
 * word list: without an entry here the knowledge base's title (and outcome label) is shown.
 */
export const TEST_WORDS: Readonly<Record<string, TestWordEntry>> = {
  'standing-pressure-check': {
    short: 'Standing pressure', long: 'Standing pressure check',
    outcomes: {
      low: { short: 'Low', long: 'Below the expected pressure' },
      'as-expected': { short: 'As expected', long: 'Within about 10 % of the expected pressure' },
      high: { short: 'High', long: 'Above the expected pressure' },
    },
  },
  'leak-search': {
    short: 'Leak search', long: 'Leak search',
    outcomes: {
      'leak-found': { short: 'Leak found', long: 'Leak found' },
      'oil-trace-only': { short: 'Oil traces only', long: 'Oil traces but no detector response' },
      'none-found': { short: 'Nothing found', long: 'Nothing found' },
    },
  },
  'nitrogen-pressure-test': {
    short: 'Nitrogen test', long: 'Nitrogen pressure test',
    outcomes: {
      'pressure-drops': { short: 'Pressure drops', long: 'Pressure falls (temperature-corrected)' },
      holds: { short: 'Holds', long: 'Pressure holds' },
    },
  },
  'vacuum-decay-test': {
    short: 'Vacuum decay', long: 'Vacuum decay test',
    outcomes: {
      'rises-steadily': { short: 'Keeps rising', long: 'Pressure keeps rising' },
      'rises-then-levels': { short: 'Rises, levels off', long: 'Rises and levels off' },
      holds: { short: 'Holds', long: 'Holds' },
    },
  },
  'restriction-temperature-drop': {
    short: 'Drier drop', long: 'Temperature drop across drier and strainer',
    outcomes: {
      'marked-drop': { short: 'Marked drop', long: 'More than about 3 K drop, or a frost spot' },
      'no-drop': { short: 'No drop', long: 'No marked drop' },
    },
  },
  'compressor-current-check': {
    short: 'Current check', long: 'Compressor current check',
    outcomes: {
      'near-zero': { short: 'About 0 A', long: 'About 0 A while called to run' },
      low: { short: 'Low', long: 'Below about 70 % of rated' },
      normal: { short: 'About rated', long: 'About rated' },
      high: { short: 'High', long: 'Above about 115 % of rated' },
    },
  },
  'compressor-pumping-test': {
    short: 'Pumping test', long: 'Compressor pumping test',
    outcomes: {
      weak: { short: 'Weak', long: 'Cannot reach the expected pressure difference' },
      strong: { short: 'Strong', long: 'Reaches it promptly' },
    },
  },
  'oil-return-line-check': {
    short: 'Oil return', long: 'Oil return line check',
    outcomes: {
      'no-return': { short: 'No return', long: 'Return line stays at room temperature, no pulses' },
      returning: { short: 'Returning', long: 'Return line warms in pulses' },
    },
  },
  'condenser-inspection': {
    short: 'Condenser', long: 'Condenser and fan inspection',
    outcomes: {
      'fouled-or-fan-fault': { short: 'Fouled or fan fault', long: 'Coil fouled, fan slow or stopped, or air recirculating' },
      'clean-and-running': { short: 'Clean and running', long: 'Coil clean, fan running, free air path' },
    },
  },
  'refrigerant-identification': {
    short: 'Identification', long: 'Refrigerant identification',
    outcomes: {
      'mismatch-or-mixture': { short: 'Mismatch', long: 'Another refrigerant, a mixture, or air flagged' },
      'matches-nameplate': { short: 'Matches', long: 'Matches the nameplate' },
    },
  },
  'sensor-verification': {
    short: 'Sensors', long: 'Sensor and control verification',
    outcomes: {
      'sensor-off': { short: 'Sensor off', long: 'Probe off by more than 2 K, or control output wrong' },
      'sensor-within-tolerance': { short: 'Within tolerance', long: 'Probe and outputs correct' },
    },
  },
  'warm-capillary-test': {
    short: 'Warm capillary', long: 'Warm capillary test',
    outcomes: {
      'flow-returns': { short: 'Flow returns', long: 'Suction pressure rises and cooling returns for a while' },
      'no-change': { short: 'No change', long: 'No change' },
    },
  },
  'door-and-load-check': {
    short: 'Door and load', long: 'Door, gasket and load check',
    outcomes: {
      'heat-load-problem': { short: 'Heat load found', long: 'Door, gasket, ice, warm load or hot room found' },
      normal: { short: 'Normal', long: 'Door, gaskets and load normal' },
    },
  },
}

/** "Standing pressure check"; `title` is the knowledge base's title for a word without an entry. */
export function testLabel(test: string, options: { form?: WordForm; title?: string | null } = {}): string {
  return labelOf(TEST_WORDS[test], test, options.form ?? 'long', options.title)
}

/** An outcome of a test in words ("Below the expected pressure"); `label` is the knowledge base's for an unlisted outcome. */
export function outcomeLabel(test: string, outcome: string, options: { form?: WordForm; label?: string | null } = {}): string {
  return labelOf(TEST_WORDS[test]?.outcomes?.[outcome], outcome, options.form ?? 'long', options.label)
}
