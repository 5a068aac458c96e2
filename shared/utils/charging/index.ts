/**
 * Charge planning: substituting another refrigerant for the nameplate one, and charging a stage by its
 * standing pressure. Used by server/api/calculations/{substitution,charging}.post.ts and the calculator page.
 */
export { AIR_CONDENSER_ABOVE_AMBIENT_K, FAR_ABOVE_NAMEPLATE_RATIO, LABEL_AMBIENTS_C, LOW_STAGE_CONDENSING_C, SUBSTITUTION_BASES, estimateRunningHead, planSubstitution, safetyClassWarnings } from './substitution'
export type { RunningHeadEstimate, SubstitutionBasis, SubstitutionInput, SubstitutionPlan, SubstitutionResult } from './substitution'
export { ON_TARGET_FRACTION, chargingCautions, chargingProgress } from './charging-progress'
export type { ChargingInput, ChargingProgress, ChargingReading } from './charging-progress'
export { MAX_STANDSTILL_AMBIENT_C, NEAR_DESIGN_PRESSURE, designPressureWarnings, pressureReading, pressureText } from './readings'
export type { PressureReading } from './readings'
