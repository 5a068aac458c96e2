// Equipment words shared by forms, the API and the diagnosis priors.
export const UNIT_KINDS = ['cascade', 'single-stage'] as const
export type UnitKind = (typeof UNIT_KINDS)[number]

export const EQUIPMENT_CLASSES = ['ult-freezer', 'cold-trap', 'test-chamber', 'freezer', 'cold-room', 'process-chiller'] as const
export type EquipmentClass = (typeof EQUIPMENT_CLASSES)[number]

export const EQUIPMENT_CLASS_LABELS: Record<EquipmentClass, string> = {
  'ult-freezer': 'Ultra-low freezer',
  'cold-trap': 'Cold trap',
  'test-chamber': 'Environmental test chamber',
  freezer: 'Freezer',
  'cold-room': 'Cold room',
  'process-chiller': 'Process chiller',
}

export const STAGE_NAMES = ['high', 'low', 'single'] as const
export type StageName = (typeof STAGE_NAMES)[number]
