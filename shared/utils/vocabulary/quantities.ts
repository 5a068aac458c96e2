import type { Quantity, Stage } from '#shared/types/diagnosis'
import { stageLabel } from './stages'
import type { WordForm, WordLabel } from './words'

/** What a reading measures. `long` names it fully; `short` fits a reading card under its stage heading. */
export const QUANTITY_WORDS: Readonly<Record<Quantity, WordLabel>> = {
  suctionPressure: { short: 'Suction', long: 'Suction pressure' },
  dischargePressure: { short: 'Discharge', long: 'Discharge pressure' },
  suctionTemperature: { short: 'Suction line', long: 'Suction line temperature' },
  dischargeTemperature: { short: 'Discharge line', long: 'Discharge line temperature' },
  liquidLineTemperature: { short: 'Liquid line', long: 'Liquid line temperature' },
  evaporatorTemperature: { short: 'Evaporator', long: 'Evaporator temperature' },
  compressorCurrent: { short: 'Current', long: 'Compressor current' },
  compressorRunning: { short: 'Running', long: 'Compressor running' },
  standingPressure: { short: 'Standing', long: 'Standing pressure (off, equalised)' },
  cabinetTemperature: { short: 'Cabinet', long: 'Cabinet temperature' },
  setpointTemperature: { short: 'Setpoint', long: 'Setpoint' },
  cascadeHxTemperature: { short: 'Cascade HX', long: 'Cascade heat exchanger' },
  ambientTemperature: { short: 'Room', long: 'Room (ambient) temperature' },
  condenserAirInTemperature: { short: 'Air in', long: 'Condenser air in' },
  condenserAirOutTemperature: { short: 'Air out', long: 'Condenser air out' },
  runtime: { short: 'Runtime', long: 'Runtime since start' },
}

/** "Suction pressure". */
export function quantityLabel(quantity: Quantity, form: WordForm = 'long'): string {
  return QUANTITY_WORDS[quantity]?.[form] ?? String(quantity)
}

/** A reading's place and quantity in words: "Low stage: suction pressure", or "Cabinet temperature" for the whole unit. */
export function readingName(reading: { quantity: Quantity; stage?: Stage | null }): string {
  const what = quantityLabel(reading.quantity)
  return reading.stage ? `${stageLabel(reading.stage)}: ${what[0]!.toLowerCase()}${what.slice(1)}` : what
}
