/**
 * Builds rank requests for the scenario suite from the state a technician would describe (saturated
 * temperatures, superheat, subcooling, current, the share of the charge left, the cabinet and the room);
 * the readings come from the domain's operating-state module, so every scenario is physically consistent
 * and shown in the units, altitude and noise it asks for.
 */
import type { Designation } from '#shared/utils/properties'
import type { Cause, RankRequest, Stage, StageConfig, Symptom, TestResult, UnitKind } from '#shared/types/diagnosis'
import type { EquipmentClass } from '#shared/types/equipment'
import { readingsForState, type Presentation, type UnitState } from '#server/domain/diagnosis/operating-state'

export type { Presentation, StageState, UnitState } from '#server/domain/diagnosis/operating-state'

// ------------------------------------------------------------------ units of the suite (invented)

export interface UnitSpec {
  kind: UnitKind
  equipmentClass: EquipmentClass
  stages: (StageConfig & { refrigerant: Designation })[]
  design: { cabinetC: number; cascadeHxC?: number }
}

const cascadeUnit = (equipmentClass: EquipmentClass, cabinetC: number, cascadeHxC: number, high: [Designation, number, number], low: [Designation, number, number, number]): UnitSpec => ({
  kind: 'cascade',
  equipmentClass,
  stages: [
    { stage: 'high', refrigerant: high[0], chargeG: high[1], ratedCurrentA: high[2] },
    { stage: 'low', refrigerant: low[0], chargeG: low[1], volumeL: low[2], ratedCurrentA: low[3] },
  ],
  design: { cabinetC, cascadeHxC },
})
const singleUnit = (equipmentClass: EquipmentClass, cabinetC: number, refrigerant: Designation, chargeG: number, ratedCurrentA: number, volumeL?: number): UnitSpec => ({
  kind: 'single-stage',
  equipmentClass,
  stages: [{ stage: 'single', refrigerant, chargeG, ratedCurrentA, ...(volumeL ? { volumeL } : {}) }],
  design: { cabinetC },
})

/** Unit types of the suite: typical lab and commercial builds, no real model. */
export const UNITS = {
  ultR404aR170: cascadeUnit('ult-freezer', -80, -32, ['R404A', 520, 6.2], ['R170', 210, 9.5, 4.1]),
  ultR290R170: cascadeUnit('ult-freezer', -86, -35, ['R290', 148, 5.4], ['R170', 92, 6.8, 3.6]),
  ultR507aR508b: cascadeUnit('ult-freezer', -80, -30, ['R507A', 600, 6.8], ['R508B', 300, 11, 4.4]),
  ultR134aR23: cascadeUnit('ult-freezer', -80, -30, ['R134a', 700, 6.0], ['R23', 250, 10, 4.0]),
  ultR290R1150: cascadeUnit('ult-freezer', -80, -35, ['R290', 600, 4.0], ['R1150', 250, 9.5, 3.5]),
  trapR404aR1150: cascadeUnit('cold-trap', -100, -38, ['R404A', 400, 5.1], ['R1150', 120, 5.5, 3.2]),
  trapR507aR1150: cascadeUnit('cold-trap', -105, -42, ['R507A', 500, 5.6], ['R1150', 160, 7, 3.4]),
  chamberR404aR23: cascadeUnit('test-chamber', -70, -28, ['R404A', 1800, 14.5], ['R23', 900, 24, 7.8]),
  chamberR134aR744: cascadeUnit('test-chamber', -40, -8, ['R134a', 2500, 9.0], ['R744', 1200, 30, 6.5]),
  chestR290: singleUnit('freezer', -25, 'R290', 145, 2.3),
  freezerR290: singleUnit('freezer', -20, 'R290', 160, 5),
  fridgeR134a: singleUnit('freezer', 5, 'R134a', 180, 1.4),
  coldRoomR404a: singleUnit('cold-room', 2, 'R404A', 6500, 11.5),
  chillerR134a: singleUnit('process-chiller', 10, 'R134a', 4200, 9.8),
  freezerR404a: singleUnit('freezer', -30, 'R404A', 900, 4.2),
} satisfies Record<string, UnitSpec>
export type UnitName = keyof typeof UNITS

export interface Scenario {
  id: string
  title: string
  /** Where the fault signature comes from: a named publication, or "common practice, no source". */
  source: string
  expected: { cause: Cause; stage?: Stage }
  equipmentClass: EquipmentClass
  request: RankRequest
}

export interface ScenarioSpec {
  id: string
  title: string
  source: string
  unit: UnitName
  expected: { cause: Cause; stage?: Stage }
  symptoms?: Symptom[]
  state: UnitState
  tests?: TestResult[]
  show?: Presentation
  /** Changes to the unit record (e.g. no charge or volume known, metering device). */
  unitPatch?: (unit: UnitSpec) => UnitSpec
}

// ------------------------------------------------------------------ building

export function buildScenario(spec: ScenarioSpec): Scenario {
  const unit = spec.unitPatch ? spec.unitPatch(UNITS[spec.unit]) : UNITS[spec.unit]
  const request: RankRequest = {
    unit: { kind: unit.kind, stages: unit.stages.map((x) => ({ ...x })), design: { ...unit.design } },
    symptoms: spec.symptoms ?? [],
    readings: readingsForState(unit, spec.state, spec.show),
  }
  if (unit.kind !== 'cascade') delete request.unit.design?.cascadeHxC
  if (spec.show?.altitudeM !== undefined) request.site = { altitudeM: spec.show.altitudeM }
  if (spec.tests) request.testResults = spec.tests
  return { id: spec.id, title: spec.title, source: spec.source, expected: spec.expected, equipmentClass: unit.equipmentClass, request }
}
