/**
 * The fact vocabulary rules may reference. One table is the single truth for three jobs:
 * validating rule files (a misspelt fact is an import error, not a rule that silently never
 * fires), telling the technician which reading would sharpen the ranking, and documenting units.
 *
 * Per-stage facts are written with a `{stage}.` prefix and exist as `high.x`, `low.x`, `single.x`.
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

const n = (name: string, unit: string, meaning: string, needs: Quantity[] = []): FactSpec => ({
  name,
  type: 'number',
  unit,
  meaning,
  needs,
})
const b = (name: string, meaning: string, needs: Quantity[] = []): FactSpec => ({
  name,
  type: 'boolean',
  unit: 'bool',
  meaning,
  needs,
})
const s = (name: string, meaning: string, needs: Quantity[] = []): FactSpec => ({
  name,
  type: 'string',
  unit: 'word',
  meaning,
  needs,
})

export const STAGE_FACTS: readonly FactSpec[] = [
  s('{stage}.refrigerant', 'Nameplate refrigerant designation of the stage'),
  n('{stage}.chargeG', 'g', 'Nameplate charge'),
  n('{stage}.volumeL', 'L', 'Internal volume of the circuit'),
  n('{stage}.ratedCurrentA', 'A', 'Rated compressor current'),
  n('{stage}.suctionPressureKpa', 'kPa abs', 'Suction pressure while running', ['suctionPressure']),
  n('{stage}.dischargePressureKpa', 'kPa abs', 'Discharge pressure while running', ['dischargePressure']),
  n('{stage}.standingPressureKpa', 'kPa abs', 'Standing pressure, system off and equalised', ['standingPressure']),
  n('{stage}.suctionTempC', '°C', 'Suction line temperature at the compressor', ['suctionTemperature']),
  n('{stage}.dischargeTempC', '°C', 'Discharge line temperature', ['dischargeTemperature']),
  n('{stage}.liquidLineTempC', '°C', 'Liquid line temperature after the condenser', ['liquidLineTemperature']),
  n('{stage}.evaporatorTempC', '°C', 'Evaporator (or cascade HX evaporating side) surface temperature', ['evaporatorTemperature']),
  n('{stage}.compressorCurrentA', 'A', 'Compressor running current', ['compressorCurrent']),
  b('{stage}.compressorRunning', 'Compressor observed running', ['compressorRunning']),
  n('{stage}.saturatedSuctionC', '°C', 'Dew temperature at suction pressure', ['suctionPressure']),
  n('{stage}.saturatedCondensingC', '°C', 'Dew temperature at discharge pressure', ['dischargePressure']),
  n('{stage}.superheatK', 'K', 'Suction superheat (suction temperature minus saturated suction)', ['suctionPressure', 'suctionTemperature']),
  n('{stage}.subcoolingK', 'K', 'Liquid subcooling (bubble temperature at discharge pressure minus liquid line temperature)', ['dischargePressure', 'liquidLineTemperature']),
  n('{stage}.compressionRatio', '–', 'Discharge over suction, absolute pressures', ['suctionPressure', 'dischargePressure']),
  n('{stage}.compressionRatioVsExpected', '–', 'Compression ratio over the ratio a healthy stage would run at (expected evaporating and condensing)', ['suctionPressure', 'dischargePressure']),
  n('{stage}.dischargeSuperheatK', 'K', 'Discharge temperature minus saturated condensing', ['dischargePressure', 'dischargeTemperature']),
  n('{stage}.expectedEvaporatingC', '°C', 'Evaporating temperature a healthy stage would show for the design or setpoint'),
  n('{stage}.suctionSatVsExpectedK', 'K', 'Saturated suction minus expected evaporating (negative = suction low)', ['suctionPressure']),
  n('{stage}.expectedCondensingC', '°C', 'Condensing temperature a healthy stage would show for its heat sink'),
  n('{stage}.condensingVsExpectedK', 'K', 'Saturated condensing minus expected condensing (positive = head high)', ['dischargePressure']),
  n('{stage}.condensingAboveAirK', 'K', 'Saturated condensing minus condenser air-in (or ambient); air-cooled stages only', ['dischargePressure']),
  n('{stage}.expectedStandingPressureKpa', 'kPa abs', 'Standing pressure expected from charge and volume, or shifted from the reference', ['ambientTemperature']),
  n('{stage}.standingRatio', '–', 'Measured over expected standing pressure', ['standingPressure', 'ambientTemperature']),
  n('{stage}.standingPercentOfExpected', '%', 'Measured standing pressure as % of expected', ['standingPressure', 'ambientTemperature']),
  n('{stage}.standingChargePercent', '%', 'Charge implied by the standing pressure as % of nameplate charge', ['standingPressure', 'ambientTemperature']),
  s('{stage}.standingPhase', 'Phase of the nameplate charge at ambient: gas, two-phase, liquid (liquid-full) or supercritical', ['ambientTemperature']),
  n('{stage}.currentPercentOfRated', '%', 'Compressor current as % of rated current', ['compressorCurrent']),
  n('{stage}.refrigerantOffsetK', 'K', 'Measured temperature minus nameplate saturation temperature at the measured pressure (negative = pressure above the curve)', ['standingPressure', 'ambientTemperature']),
  n('{stage}.refrigerantFitK', 'K', 'How far a measured saturated pressure–temperature pair lies from the nameplate refrigerant curve', ['standingPressure', 'ambientTemperature']),
  s('{stage}.bestFitRefrigerant', 'Candidate refrigerant whose curve lies closest to the measured pair', ['standingPressure', 'ambientTemperature']),
  n('{stage}.bestFitK', 'K', 'Distance of the measured pair from the best-fitting candidate curve', ['standingPressure', 'ambientTemperature']),
  b('{stage}.refrigerantMismatch', 'Nameplate refrigerant misfits the measured pair and another candidate fits', ['standingPressure', 'ambientTemperature']),
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
  n('cascadeHxC', '°C', 'Cascade heat exchanger temperature', ['cascadeHxTemperature']),
  n('cascadeHxAboveDesignK', 'K', 'Cascade HX minus its design temperature (positive = warm)', ['cascadeHxTemperature']),
  n('condenserAirInC', '°C', 'Air entering the air-cooled condenser', ['condenserAirInTemperature']),
  n('condenserAirOutC', '°C', 'Air leaving the air-cooled condenser', ['condenserAirOutTemperature']),
  n('condenserAirDeltaK', 'K', 'Condenser air temperature rise', ['condenserAirInTemperature', 'condenserAirOutTemperature']),
  n('runtimeMin', 'min', 'Running time since start or since the last door opening', ['runtime']),
  b('pulldownStalled', 'Long runtime yet the cabinet is still far above target', ['runtime', 'cabinetTemperature']),
  { ...n('cabinetToEvaporatorK', 'K', 'Cabinet minus cabinet-stage evaporator temperature', ['cabinetTemperature', 'evaporatorTemperature']), needsStage: 'cabinet' },
  { ...n('lowCondensingAboveCascadeHxK', 'K', 'Low-stage saturated condensing minus cascade HX temperature', ['dischargePressure', 'cascadeHxTemperature']), needsStage: 'low' },
  { ...n('highSuctionBelowCascadeHxK', 'K', 'Cascade HX temperature minus high-stage saturated suction', ['suctionPressure', 'cascadeHxTemperature']), needsStage: 'high' },
  ...SYMPTOMS.map((sym) => b(`symptom.${sym}`, `Technician reports "${sym}"`)),
]

export function stageFactName(template: string, stage: Stage): string {
  return template.replace('{stage}', stage)
}

/** Every concrete fact name, per-stage ones expanded for all three stages. */
export const FACT_SPECS: ReadonlyMap<string, FactSpec & { stage?: Stage }> = new Map([
  ...STAGES.flatMap((stage) =>
    STAGE_FACTS.map((f) => [stageFactName(f.name, stage), { ...f, name: stageFactName(f.name, stage), stage }] as const),
  ),
  ...UNIT_FACTS.map((f) => [f.name, f] as const),
])

export function isKnownFact(name: string): boolean {
  return FACT_SPECS.has(name)
}
