import type { MeteringDevice, UnitKind } from '#shared/types/diagnosis'
import type { EquipmentClass } from '#shared/types/equipment'
import type { WordForm, WordLabel } from './words'

/** Kinds of unit: two circuits in cascade, or one. */
export const UNIT_KIND_WORDS: Readonly<Record<UnitKind, WordLabel>> = {
  cascade: { short: 'Cascade', long: 'Two-stage cascade' },
  'single-stage': { short: 'Single stage', long: 'Single-stage system' },
}

/** "Cascade". */
export function unitKindLabel(kind: UnitKind, form: WordForm = 'short'): string {
  return UNIT_KIND_WORDS[kind]?.[form] ?? String(kind)
}

/** What the unit is for; also groups closed cases when the diagnosis learns from them. */
export const EQUIPMENT_CLASS_WORDS: Readonly<Record<EquipmentClass, WordLabel>> = {
  'ult-freezer': { short: 'ULT freezer', long: 'Ultra-low freezer' },
  'cold-trap': { short: 'Cold trap', long: 'Cold trap' },
  'test-chamber': { short: 'Test chamber', long: 'Environmental test chamber' },
  freezer: { short: 'Freezer', long: 'Freezer' },
  'cold-room': { short: 'Cold room', long: 'Cold room' },
  'process-chiller': { short: 'Chiller', long: 'Process chiller' },
}

/** "Ultra-low freezer". */
export function equipmentClassLabel(equipmentClass: EquipmentClass, form: WordForm = 'long'): string {
  return EQUIPMENT_CLASS_WORDS[equipmentClass]?.[form] ?? String(equipmentClass)
}

/** How a stage is fed with liquid. */
export const METERING_DEVICE_WORDS: Readonly<Record<MeteringDevice, WordLabel>> = {
  capillary: { short: 'Capillary tube', long: 'Capillary tube (fixed restriction)' },
  'expansion-valve': { short: 'Expansion valve', long: 'Thermostatic or electronic expansion valve' },
}

/** "Capillary tube"; "not recorded" when the unit record does not say. */
export function meteringDeviceLabel(device: MeteringDevice | null | undefined, form: WordForm = 'short'): string {
  return device ? METERING_DEVICE_WORDS[device]?.[form] ?? String(device) : 'not recorded'
}
