import type { ChargingProgress, SubstitutionResult } from '#shared/utils/charging'

/** `POST /api/calculations/substitution`: the chosen basis's plan at the top level, all three bases in `plans`. */
export type SubstitutionDto = SubstitutionResult

/** `POST /api/calculations/charging`: grams now, grams to go and % of target, or the pressure to expect. */
export type ChargingDto = ChargingProgress
