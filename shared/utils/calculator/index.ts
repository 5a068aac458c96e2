/**
 * Calculator look-ups over the property module, shaped as the refrigerant API answers them.
 * Used by server/api/refrigerants/**, server/api/calculations/*.post.ts and app/pages/calculator.vue.
 */
export { resolveRefrigerant, saturationAtPressure, saturationAtTemperature, saturationLookup } from './saturation'
export { convertReading } from './convert'
export { standingCheck } from './standing'
export { chargingCheck, substitutionPlan } from './charging'
export { absoluteKpa } from './pressure'
