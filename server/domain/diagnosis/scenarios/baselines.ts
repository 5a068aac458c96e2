/**
 * Healthy running states of the suite's unit types; scenarios start from these and change what their
 * fault changes. The healthy references are documented in the operating-state module.
 */
import { healthyState, STOPPED_STAGE } from '#server/domain/diagnosis/operating-state'
import { UNITS, type UnitName, type UnitState } from './builder'

export { withState } from '#server/domain/diagnosis/operating-state'

/** Healthy state of a unit of the suite in a room at `ambient` °C. */
export function healthy(name: UnitName, ambient = 22): UnitState {
  return healthyState(UNITS[name], ambient)
}

export const stopped = STOPPED_STAGE
