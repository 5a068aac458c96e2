// The refrigerant log's words: why refrigerant was added, leak checks and repairs, duties that fall
// due, cylinder uses and appliance types.
import { APPLIANCE_TYPE_LABELS, type ApplianceType } from '#shared/types/compliance'
import type { AdditionPurpose, CheckKind, CylinderPurpose, DutyDto } from '#shared/types/refrigerant-log'
import type { WordForm, WordLabel } from './words'

/** Why refrigerant was added. */
export const ADDITION_PURPOSE_WORDS: Readonly<Record<AdditionPurpose, WordLabel>> = {
  'top-up': { short: 'Top-up', long: 'Top-up to make up a loss' },
  recharge: { short: 'Recharge', long: 'Recharge after a repair (what was recovered is put back first)' },
  'initial-charge': { short: 'First charge', long: 'First charge of a new installation' },
  retrofit: { short: 'Retrofit', long: 'Charge right after a retrofit to another refrigerant' },
  'seasonal-variance': { short: 'Seasonal', long: 'Seasonal variance: refrigerant removed for the season put back' },
}

/** Leak checks, repairs and verification tests as the log records them. */
export const CHECK_KIND_WORDS: Readonly<Record<CheckKind, WordLabel>> = {
  'leak-check': { short: 'Leak check', long: 'Leak check or inspection' },
  repair: { short: 'Repair', long: 'Leak repair' },
  'initial-verification': { short: 'Initial verification', long: 'Initial verification test of a repair' },
  'follow-up-verification': { short: 'Follow-up verification', long: 'Follow-up verification test of a repair' },
  'chronic-leak-report': { short: 'Leak report', long: 'Report of a chronically leaking appliance' },
}

/** What a unit can be due. */
export const DUTY_KIND_WORDS: Readonly<Record<DutyDto['kind'], WordLabel>> = {
  repair: { short: 'Repair', long: 'Repair the leak' },
  'verification-test': { short: 'Verify repair', long: 'Verification test of the repair' },
  'leak-inspection': { short: 'Leak inspection', long: 'Leak inspection' },
  'leak-check': { short: 'Leak check', long: 'Periodic leak check' },
  'recheck-after-repair': { short: 'Re-check', long: 'Re-check of the repair' },
  'chronic-leak-report': { short: 'Report', long: 'Report the chronic leak' },
}

/** What a cylinder is used for. */
export const CYLINDER_PURPOSE_WORDS: Readonly<Record<CylinderPurpose, WordLabel>> = {
  recovery: { short: 'Recovery', long: 'Recovery cylinder' },
  supply: { short: 'Supply', long: 'Supply cylinder (charging)' },
}

/** "Top-up". */
export function additionPurposeLabel(purpose: AdditionPurpose, form: WordForm = 'short'): string {
  return ADDITION_PURPOSE_WORDS[purpose]?.[form] ?? String(purpose)
}
/** "Leak check". */
export function checkKindLabel(kind: CheckKind, form: WordForm = 'short'): string {
  return CHECK_KIND_WORDS[kind]?.[form] ?? String(kind)
}
/** "Verify repair". */
export function dutyKindLabel(kind: DutyDto['kind'], form: WordForm = 'short'): string {
  return DUTY_KIND_WORDS[kind]?.[form] ?? String(kind)
}
/** "Recovery". */
export function cylinderPurposeLabel(purpose: CylinderPurpose, form: WordForm = 'short'): string {
  return CYLINDER_PURPOSE_WORDS[purpose]?.[form] ?? String(purpose)
}
/** Appliance types short enough for a select on a phone; the long form says what each covers. */
export const APPLIANCE_TYPE_SHORT: Readonly<Record<ApplianceType, string>> = {
  'commercial-refrigeration': 'Commercial refrigeration',
  'industrial-process-refrigeration': 'Industrial process',
  'comfort-cooling': 'Comfort cooling',
  'refrigerated-transport': 'Refrigerated transport',
  other: 'Other (lab, test equipment)',
  'residential-light-commercial-ac': 'Home or light-commercial AC',
}
/** "Commercial refrigeration (retail food, cold storage)", or "Commercial refrigeration" in the short form. */
export function applianceTypeLabel(type: ApplianceType, form: WordForm = 'long'): string {
  return (form === 'short' ? APPLIANCE_TYPE_SHORT[type] : APPLIANCE_TYPE_LABELS[type]) ?? String(type)
}
