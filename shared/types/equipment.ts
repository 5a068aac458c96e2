// Equipment words shared by forms, the API and the diagnosis priors. Unit kinds and stage names
// live with the diagnosis vocabulary (shared/types/diagnosis.ts).
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
