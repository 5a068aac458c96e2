/**
 * The fact vocabulary findings may reference. One table is the single truth for three jobs:
 * validating rule files (a misspelt fact is an import error, not a finding that silently never
 * applies), telling the technician which reading would sharpen the ranking, and documenting units.
 *
 * Per-stage facts are written with a `{stage}.` prefix and exist as `high.x`, `low.x`, `single.x`.
 * Residuals (`…ResidualK`, `…ResidualPct`) are measured minus what a healthy unit shows under the
 * same conditions; each has an `…Uncertainty…` fact with the standard uncertainty of the measurement.
 */
import { SYMPTOMS, STAGES, type Quantity, type Stage } from '#shared/types/diagnosis'

export type FactType = 'number' | 'boolean' | 'string'

export interface FactSpec {
  /** Name; `{stage}.` in front marks a per-stage fact. */
  name: string
  type: FactType
  unit: string
  meaning: string
  /** Readings (of the same stage for per-stage facts) that must be present for the fact to exist. */
  needs: Quantity[]
  /** For unit-wide facts built from per-stage readings: which stage those readings come from. */
  needsStage?: Stage | 'cabinet'
}

const n = (name: string, unit: string, meaning: string, needs: Quantity[] = []): FactSpec => ({ name, type: 'number', unit, meaning, needs })
const b = (name: string, meaning: string, needs: Quantity[] = []): FactSpec => ({ name, type: 'boolean', unit: 'bool', meaning, needs })
const s = (name: string, meaning: string, needs: Quantity[] = []): FactSpec => ({ name, type: 'string', unit: 'word', meaning, needs })

const RUNNING: Quantity[] = ['suctionPressure']
const HEAD: Quantity[] = ['dischargePressure']
const STANDING: Quantity[] = ['standingPressure', 'ambientTemperature']

export const STAGE_FACTS: readonly FactSpec[] = [
  s('{stage}.refrigerant', 'Nameplate refrigerant designation of the stage'),
  n('{stage}.chargeG', 'g', 'Nameplate charge'),
  n('{stage}.volumeL', 'L', 'Internal volume of the circuit'),
  n('{stage}.ratedCurrentA', 'A', 'Rated compressor current'),
  s('{stage}.meteringDevice', 'capillary or expansion-valve, when the unit record says'),
  n('{stage}.suctionPressureKpa', 'kPa abs', 'Suction pressure while running', ['suctionPressure']),
  n('{stage}.dischargePressureKpa', 'kPa abs', 'Discharge pressure while running', ['dischargePressure']),
  n('{stage}.standingPressureKpa', 'kPa abs', 'Standing pressure, system off and equalised', ['standingPressure']),
  n('{stage}.suctionTempC', '°C', 'Suction line temperature at the compressor', ['suctionTemperature']),
  n('{stage}.dischargeTempC', '°C', 'Discharge line temperature', ['dischargeTemperature']),
  n('{stage}.liquidLineTempC', '°C', 'Liquid line temperature after the condenser', ['liquidLineTemperature']),
  n('{stage}.evaporatorTempC', '°C', 'Evaporator (or cascade HX evaporating side) surface temperature', ['evaporatorTemperature']),
  n('{stage}.compressorCurrentA', 'A', 'Compressor running current', ['compressorCurrent']),
  b('{stage}.compressorRunning', 'Compressor reported running', ['compressorRunning']),
  b('{stage}.running', 'Compressor running when the readings were taken: reported, or inferred from current or pressures', ['compressorRunning']),
  b('{stage}.stoppedWhileCalled', 'Compressor stopped (or drawing no current) while the cabinet calls for cooling', ['compressorRunning']),
  s('{stage}.workingRefrigerant', 'Refrigerant the derived values use: the nameplate one, or the best fit when the readings fit another'),
  n('{stage}.saturatedSuctionC', '°C', 'Dew temperature at suction pressure', RUNNING),
  n('{stage}.saturatedCondensingC', '°C', 'Dew temperature at discharge pressure', HEAD),
  n('{stage}.superheatK', 'K', 'Suction superheat (suction temperature minus saturated suction)', ['suctionPressure', 'suctionTemperature']),
  n('{stage}.superheatUncertaintyK', 'K', 'Standard uncertainty of the superheat', ['suctionPressure', 'suctionTemperature']),
  n('{stage}.subcoolingK', 'K', 'Liquid subcooling (bubble temperature at discharge pressure minus liquid line temperature)', ['dischargePressure', 'liquidLineTemperature']),
  n('{stage}.subcoolingUncertaintyK', 'K', 'Standard uncertainty of the subcooling', ['dischargePressure', 'liquidLineTemperature']),
  n('{stage}.compressionRatio', '–', 'Discharge over suction, absolute pressures', ['suctionPressure', 'dischargePressure']),
  n('{stage}.dischargeSuperheatK', 'K', 'Discharge temperature minus saturated condensing', ['dischargePressure', 'dischargeTemperature']),
  n('{stage}.expectedEvaporatingC', '°C', 'Evaporating temperature a healthy stage runs at for the cabinet target (cabinet stage) or the cascade heat exchanger (high stage)'),
  n('{stage}.evaporatingResidualK', 'K', 'Saturated suction minus expected evaporating (negative = suction low)', RUNNING),
  n('{stage}.evaporatingUncertaintyK', 'K', 'Standard uncertainty of the evaporating residual', RUNNING),
  n('{stage}.expectedCondensingC', '°C', 'Condensing temperature a healthy stage runs at for its heat sink (condenser air, or the cascade heat exchanger design)'),
  n('{stage}.condensingResidualK', 'K', 'Saturated condensing minus expected condensing (positive = head high)', HEAD),
  n('{stage}.condensingUncertaintyK', 'K', 'Standard uncertainty of the condensing residual', HEAD),
  n('{stage}.condensingAboveAirK', 'K', 'Saturated condensing minus condenser air-in (or ambient); air-cooled stages only', HEAD),
  n('{stage}.currentPercentOfRated', '%', 'Compressor current as % of rated current', ['compressorCurrent']),
  n('{stage}.expectedStandingPressureKpa', 'kPa abs', 'Standing pressure expected from charge and volume, or shifted from the reference', ['ambientTemperature']),
  s('{stage}.standingPhase', 'Phase of the nameplate charge at ambient: gas, two-phase, liquid (liquid-full) or supercritical', ['ambientTemperature']),
  n('{stage}.standingRatio', '–', 'Measured over expected standing pressure', STANDING),
  n('{stage}.standingPercentOfExpected', '%', 'Measured standing pressure as % of expected', STANDING),
  n('{stage}.standingResidualPct', '%', 'Measured standing pressure minus expected, % of expected', STANDING),
  n('{stage}.standingUncertaintyPct', '%', 'Standard uncertainty of the standing residual, % of expected', STANDING),
  n('{stage}.standingChargePercent', '%', 'Charge implied by the standing pressure as % of nameplate charge', STANDING),
  n('{stage}.refrigerantOffsetK', 'K', 'Measured temperature minus the nameplate saturation temperature at the measured pressure (negative = pressure above the curve); 0 inside the glide', ['standingPressure', 'ambientTemperature']),
  n('{stage}.refrigerantOffsetUncertaintyK', 'K', 'Standard uncertainty of the offset', ['standingPressure', 'ambientTemperature']),
  s('{stage}.fitSource', 'Which pair the refrigerant fit used: standing (pressure at ambient) or running (evaporator against suction)', ['standingPressure', 'ambientTemperature']),
  n('{stage}.refrigerantFitK', 'K', 'How far the measured saturated pair lies from the nameplate refrigerant curve', ['standingPressure', 'ambientTemperature']),
  s('{stage}.bestFitRefrigerant', 'Candidate refrigerant whose curve lies closest to the measured pair', ['standingPressure', 'ambientTemperature']),
  n('{stage}.bestFitK', 'K', 'Distance of the measured pair from the best-fitting candidate curve', ['standingPressure', 'ambientTemperature']),
  b('{stage}.refrigerantMismatch', 'The nameplate refrigerant misfits the measured pair and another candidate fits it closely', ['standingPressure', 'ambientTemperature']),
  n('{stage}.evaporatorVsSaturationK', 'K', 'Evaporator probe minus saturated suction (a running coil is never colder than its saturation)', ['suctionPressure', 'evaporatorTemperature']),
]

export const UNIT_FACTS: readonly FactSpec[] = [
  s('unit.kind', 'cascade or single-stage'),
  b('unit.isCascade', 'True for a two-stage cascade'),
  n('design.cabinetC', '°C', 'Design cabinet temperature'),
  n('design.cascadeHxC', '°C', 'Design cascade heat exchanger temperature'),
  n('ambientC', '°C', 'Room temperature around the unit', ['ambientTemperature']),
  n('cabinetC', '°C', 'Cabinet air temperature', ['cabinetTemperature']),
  n('setpointC', '°C', 'Controller setpoint', ['setpointTemperature']),
  n('targetCabinetC', '°C', 'Setpoint, or design cabinet temperature when no setpoint is given'),
  n('cabinetAboveTargetK', 'K', 'Cabinet minus target (positive = warm)', ['cabinetTemperature']),
  b('calledToRun', 'The cabinet is warm enough (or the complaint says so) that the compressors should be running'),
  n('cascadeHxC', '°C', 'Cascade heat exchanger temperature', ['cascadeHxTemperature']),
  n('cascadeHxAboveDesignK', 'K', 'Cascade HX minus its design temperature (positive = warm)', ['cascadeHxTemperature']),
  n('condenserAirInC', '°C', 'Air entering the air-cooled condenser', ['condenserAirInTemperature']),
  n('condenserAirOutC', '°C', 'Air leaving the air-cooled condenser', ['condenserAirOutTemperature']),
  n('condenserAirRiseK', 'K', 'Condenser air temperature rise', ['condenserAirInTemperature', 'condenserAirOutTemperature']),
  n('runtimeMin', 'min', 'Running time since start or since the last door opening', ['runtime']),
  b('pulldownStalled', 'Long runtime yet the cabinet is still far above target', ['runtime', 'cabinetTemperature']),
  { ...n('cabinetVsEvaporatingK', 'K', 'Cabinet minus (saturated suction + the evaporator difference of a healthy coil) on the cabinet stage; positive = cabinet warmer than the evaporating temperature explains', ['cabinetTemperature', 'suctionPressure']), needsStage: 'cabinet' },
  { ...n('cabinetVsEvaporatingUncertaintyK', 'K', 'Standard uncertainty of the cabinet-against-evaporating residual', ['cabinetTemperature', 'suctionPressure']), needsStage: 'cabinet' },
  { ...n('cabinetToEvaporatorK', 'K', 'Cabinet minus cabinet-stage evaporator probe', ['cabinetTemperature', 'evaporatorTemperature']), needsStage: 'cabinet' },
  { ...n('lowCondensingAboveCascadeHxK', 'K', 'Low-stage saturated condensing minus cascade HX temperature', ['dischargePressure', 'cascadeHxTemperature']), needsStage: 'low' },
  { ...n('cascadeHxAboveHighSuctionK', 'K', 'Cascade HX temperature minus high-stage saturated suction', ['suctionPressure', 'cascadeHxTemperature']), needsStage: 'high' },
  ...SYMPTOMS.map((sym) => b(`symptom.${sym}`, `Technician reports "${sym}"`)),
]

export function stageFactName(template: string, stage: Stage): string {
  return template.replace('{stage}', stage)
}

/** Every concrete fact name, per-stage ones expanded for all three stages. */
export const FACT_SPECS: ReadonlyMap<string, FactSpec & { stage?: Stage }> = new Map([
  ...STAGES.flatMap((stage) => STAGE_FACTS.map((f) => [stageFactName(f.name, stage), { ...f, name: stageFactName(f.name, stage), stage }] as const)),
  ...UNIT_FACTS.map((f) => [f.name, f] as const),
])

export function isKnownFact(name: string): boolean {
  return FACT_SPECS.has(name)
}
