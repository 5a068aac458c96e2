// Equipment words shared by forms, the API and the diagnosis priors. Unit kinds and stage names
// live with the diagnosis words (shared/types/diagnosis.ts); what people read for each is in the
// vocabulary (shared/utils/vocabulary/equipment.ts).
export const EQUIPMENT_CLASSES = ['ult-freezer', 'cold-trap', 'test-chamber', 'freezer', 'cold-room', 'process-chiller'] as const
export type EquipmentClass = (typeof EQUIPMENT_CLASSES)[number]

/** Columns the equipment register can sort by (`GET /api/equipment/units?sort=`). */
export const UNIT_SORTS = ['name', 'customer', 'kind', 'serial'] as const
export type UnitSort = (typeof UNIT_SORTS)[number]

/** Orders of the customer list (`GET /api/customers?sort=`). */
export const CUSTOMER_SORTS = ['name', 'createdAt'] as const
export type CustomerSort = (typeof CUSTOMER_SORTS)[number]

export const SORT_DIRECTIONS = ['asc', 'desc'] as const
export type SortDirection = (typeof SORT_DIRECTIONS)[number]
