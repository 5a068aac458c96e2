/**
 * Vocabulary and wire types of the compliance calculations (`POST /api/calculations/leak-rate`,
 * `POST /api/calculations/co2e`). The word lists feed the zod schemas in shared/schemas/compliance.ts,
 * the data-file schemas in server/domain/compliance and, later, the refrigerant-log forms.
 */

/** The two leak-rate methods of the US rules (40 CFR 82.152, 84.106(b)). */
export const LEAK_RATE_METHODS = ['annualizing', 'rolling-average'] as const
export type LeakRateMethod = (typeof LEAK_RATE_METHODS)[number]

/**
 * Appliance types the US leak-rate limits are set for. Lab and process freezers that are neither retail
 * food nor cold storage nor custom-built plant usually count as `other`; the owner decides the category.
 */
export const APPLIANCE_TYPES = [
  'commercial-refrigeration',
  'industrial-process-refrigeration',
  'comfort-cooling',
  'refrigerated-transport',
  'other',
  'residential-light-commercial-ac',
] as const
export type ApplianceType = (typeof APPLIANCE_TYPES)[number]

export const APPLIANCE_TYPE_LABELS: Readonly<Record<ApplianceType, string>> = {
  'commercial-refrigeration': 'Commercial refrigeration (retail food, cold storage)',
  'industrial-process-refrigeration': 'Industrial process refrigeration',
  'comfort-cooling': 'Comfort cooling',
  'refrigerated-transport': 'Refrigerated transport',
  other: 'Other appliances (e.g. lab and test equipment)',
  'residential-light-commercial-ac': 'Residential or light-commercial air conditioning',
}

/** Which EU F-gas regulation a CO2-equivalent figure is worked out under. */
export const F_GAS_BASES = ['eu-2014', 'eu-2024'] as const
export type FGasBasis = (typeof F_GAS_BASES)[number]

/** How sure we are of a figure: read in the regulation, a secondary summary, recalled, or computed. */
export type SourceStatus = 'regulation text' | 'secondary' | 'from memory' | 'computed'

export interface SourceRef {
  title: string
  url?: string
  status: SourceStatus
}

/** Whether a leak-rate limit applies to a stage and, if so, whether the rate exceeds it, in words. */
export interface LeakRateAssessmentDto {
  jurisdiction: string
  /** true: a rule in force covers this refrigerant and charge; false: none does; null: not enough known. */
  applies: boolean | null
  rule: { id: string; title: string; citation: string } | null
  thresholdPercent: number | null
  exceedsThreshold: boolean | null
  /** The repair deadline in days after the addition, when the limit is exceeded. */
  repairWithinDays: number | null
  text: string[]
  sources: SourceRef[]
}

/** `POST /api/calculations/leak-rate` answer: the contract's `leakRatePercent` plus how it was found. */
export interface LeakRateDto {
  leakRatePercent: number
  method: LeakRateMethod
  /** The regulation's formula with the request's numbers in it. */
  working: string
  daysUsed?: number
  assessment?: LeakRateAssessmentDto
}

export type FGasScope = 'annex-i' | 'annex-ii' | 'annex-ii-group-1' | 'not-f-gas'

/** `POST /api/calculations/co2e` answer: the contract's three fields plus the reasoning. */
export interface Co2eDto {
  /** t CO2e = charge (kg) × GWP / 1000; null when the regulation gives no GWP for this gas. */
  tonnesCo2e: number | null
  gwp: number | null
  /** null when no periodic leak check is required. */
  leakCheckIntervalMonths: number | null
  designation: string
  basis: FGasBasis
  regulation: string
  fGas: boolean
  scope: FGasScope
  leakCheckRequired: boolean
  hermeticExemption: boolean
  leakDetectionSystemRequired: boolean
  text: string[]
  sources: SourceRef[]
}
