// The invented service history of the demo: closed cases with readings, tests, findings and
// refrigerant transactions, and two open cases. Numbers are built from the property module so the
// readings agree with each other (a leaking stage really shows a low standing pressure).
import type { CloseInput } from '#server/domain/cases/case-changes'
import type { Reading, Stage, Symptom, TestSlug } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { isDesignation, saturationPressure, standingPressureFromCharge } from '#shared/utils/properties'

export interface DemoCase {
  complaint: string
  symptoms: Symptom[]
  readings: Reading[]
  tests: { test: TestSlug; stage: Stage; outcome: string }[]
  note?: string
  close?: CloseInput
}

type Scenario = (unit: UnitDto, n: number) => DemoCase

const r = (quantity: Reading['quantity'], value: number | boolean, unit: Reading['unit'], stage?: Stage): Reading =>
  (stage ? { quantity, stage, value, unit } : { quantity, value, unit }) as Reading
const round = (x: number, d = 0) => Math.round(x * 10 ** d) / 10 ** d
const AMBIENT = [21, 23, 19, 24, 22, 20]

/** Standing pressure (kPa abs) of a stage holding `fraction` of its nameplate charge. */
function standing(unit: UnitDto, stage: Stage, fraction: number, ambientC: number): number | undefined {
  const s = unit.stages.find((x) => x.stage === stage)
  if (!s?.chargeG || !s.volumeL || !isDesignation(s.refrigerant)) return undefined
  return round(standingPressureFromCharge({ designation: s.refrigerant, ambientC, volumeL: s.volumeL, chargeG: s.chargeG * fraction }).pressureKpa)
}
function satKpa(unit: UnitDto, stage: Stage, tC: number, side: 'bubble' | 'dew' = 'dew'): number {
  const d = unit.stages.find((x) => x.stage === stage)!.refrigerant
  if (!isDesignation(d)) return 100
  const p = saturationPressure(d, tC)
  return round(side === 'bubble' ? p.bubbleKpa : p.dewKpa)
}
const refrigerantOf = (unit: UnitDto, stage: Stage) => unit.stages.find((s) => s.stage === stage)!.refrigerant
const cabinetStage = (unit: UnitDto): Stage => (unit.kind === 'cascade' ? 'low' : 'single')
const heatStage = (unit: UnitDto): Stage => (unit.kind === 'cascade' ? 'high' : 'single')

function base(unit: UnitDto, cabinetC: number, n: number): Reading[] {
  const out = [r('cabinetTemperature', cabinetC, 'C'), r('setpointTemperature', unit.design.cabinetC ?? -80, 'C'), r('ambientTemperature', AMBIENT[n % AMBIENT.length]!, 'C')]
  if (unit.kind === 'cascade') out.push(r('compressorRunning', true, 'bool', 'high'), r('compressorRunning', true, 'bool', 'low'))
  return out
}

const lowStageLeak: Scenario = (unit, n) => {
  const s = cabinetStage(unit)
  const amb = AMBIENT[n % AMBIENT.length]!
  const p = standing(unit, s, 0.35 + (n % 3) * 0.1, amb)
  const grams = round((unit.stages.find((x) => x.stage === s)?.chargeG ?? 200) * 0.6)
  return {
    complaint: n % 2 ? 'Temperature alarm overnight; cabinet drifting up' : 'Will not get below -50 °C after a door-open event',
    symptoms: ['not-cooling', 'warming-over-days'],
    readings: [
      ...base(unit, (unit.design.cabinetC ?? -80) + 32 + (n % 5), n),
      ...(unit.kind === 'cascade' ? [r('cascadeHxTemperature', (unit.design.cascadeHxC ?? -30) - 1, 'C')] : []),
      ...(p ? [r('standingPressure', p, 'kPa', s)] : []),
    ],
    tests: [
      { test: 'standing-pressure-check', stage: s, outcome: 'low' },
      { test: 'leak-search', stage: s, outcome: 'leak-found' },
      { test: 'nitrogen-pressure-test', stage: s, outcome: 'holds' },
    ],
    close: {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: s }],
      workDone: `Leak found at ${['a flare nut on the drier', 'the service valve core', 'a cracked capillary joint', 'a brazed joint at the evaporator inlet'][n % 4]}; repaired under a dry-nitrogen purge, nitrogen pressure test held, evacuated to 250 microns, charged by weight.`,
      parts: ['Filter drier', n % 2 ? 'Valve core' : 'Flare nut'],
      refrigerantTransactions: [{ stage: s, refrigerant: refrigerantOf(unit, s), grams, direction: 'added', cylinder: `CYL-${refrigerantOf(unit, s)}-${100 + n}` }],
      unitStateAtDeparture: `Pulling down; cabinet ${round((unit.design.cabinetC ?? -80) + 25)} °C after 90 min`,
      followUp: 'Check the cabinet log in one week.',
    },
  }
}

const lowStageBlockage = (cause: 'moisture-freeze' | 'oil-return-blocked' | 'restriction'): Scenario => (unit, n) => {
  const s = cabinetStage(unit)
  const amb = AMBIENT[n % AMBIENT.length]!
  const p = standing(unit, s, 0.98, amb)
  const test: DemoCase['tests'][number] =
    cause === 'moisture-freeze' ? { test: 'warm-capillary-test', stage: s, outcome: 'flow-returns' }
      : cause === 'oil-return-blocked' ? { test: 'oil-return-line-check', stage: s, outcome: 'no-return' }
        : { test: 'restriction-temperature-drop', stage: s, outcome: 'marked-drop' }
  const charge = unit.stages.find((x) => x.stage === s)?.chargeG ?? 200
  return {
    complaint: 'Cools for a few hours after a restart, then the cabinet warms again',
    symptoms: cause === 'moisture-freeze' ? ['intermittent-cooling', 'recently-serviced'] : ['slow-pulldown', 'frost-on-capillary'],
    readings: [...base(unit, (unit.design.cabinetC ?? -80) + 25, n), ...(unit.kind === 'cascade' ? [r('cascadeHxTemperature', (unit.design.cascadeHxC ?? -30), 'C')] : []), ...(p ? [r('standingPressure', p, 'kPa', s)] : [])],
    tests: [{ test: 'standing-pressure-check', stage: s, outcome: 'as-expected' }, test],
    close: {
      confirmedCauses: [{ cause, stage: s }],
      workDone: cause === 'moisture-freeze'
        ? 'Moisture ice at the capillary inlet. Recovered the charge, replaced the drier, triple evacuation to 250 microns with a decay test, recharged with new refrigerant.'
        : cause === 'oil-return-blocked'
          ? 'Oil-return capillary from the separator blocked. Replaced the capillary and strainer under a dry-nitrogen purge, evacuated and recharged.'
          : 'Partly blocked strainer ahead of the capillary. Replaced strainer and drier, evacuated and recharged.',
      parts: cause === 'oil-return-blocked' ? ['Oil-return capillary', 'Strainer'] : ['Filter drier'],
      refrigerantTransactions: [
        { stage: s, refrigerant: refrigerantOf(unit, s), grams: round(charge * 0.97), direction: 'recovered', cylinder: `REC-${200 + n}` },
        { stage: s, refrigerant: refrigerantOf(unit, s), grams: charge, direction: 'added', cylinder: `CYL-${refrigerantOf(unit, s)}-${300 + n}` },
      ],
      unitStateAtDeparture: 'Holding setpoint after two hours',
      followUp: cause === 'moisture-freeze' ? 'Ask who serviced it last; moisture came in with that work.' : '',
    },
  }
}

const condenserAirflow: Scenario = (unit, n) => {
  const s = heatStage(unit)
  const sct = 56 + (n % 4)
  return {
    complaint: 'Warm in the afternoons; the room gets hot',
    symptoms: ['slow-pulldown'],
    readings: [
      ...base(unit, unit.kind === 'cascade' ? (unit.design.cabinetC ?? -80) + 15 : (unit.design.cabinetC ?? -20) + 8, n),
      ...(unit.kind === 'cascade' ? [r('cascadeHxTemperature', (unit.design.cascadeHxC ?? -30) + 14, 'C')] : []),
      r('dischargePressure', satKpa(unit, s, sct, 'bubble'), 'kPa', s),
      r('condenserAirInTemperature', 27, 'C'),
      r('condenserAirOutTemperature', 36, 'C'),
    ],
    tests: [{ test: 'condenser-inspection', stage: s, outcome: 'fouled-or-fan-fault' }],
    close: {
      confirmedCauses: [{ cause: 'condenser-airflow', stage: s }],
      workDone: n % 2 ? 'Condenser coil matted with dust; cleaned with brush and vacuum, checked fan.' : 'Condenser fan motor seized; replaced motor, cleaned coil.',
      parts: n % 2 ? [] : ['Condenser fan motor'],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'Discharge pressure back to normal',
      followUp: 'Put the condenser on the quarterly cleaning round.',
    },
  }
}

const compressorElectrical: Scenario = (unit, n) => {
  const s = heatStage(unit)
  return {
    complaint: 'Unit alarming; compressor clicks and stops',
    symptoms: ['compressor-tripping', 'not-cooling'],
    readings: [
      r('cabinetTemperature', (unit.design.cabinetC ?? -80) + 45, 'C'), r('setpointTemperature', unit.design.cabinetC ?? -80, 'C'),
      r('compressorRunning', false, 'bool', s), r('compressorCurrent', 0, 'A', s),
    ],
    tests: [{ test: 'compressor-current-check', stage: s, outcome: 'near-zero' }],
    close: {
      confirmedCauses: [{ cause: 'compressor-electrical', stage: s }],
      workDone: n % 2 ? 'Start relay burnt; replaced relay and overload.' : 'Start capacitor failed; replaced, checked windings to earth.',
      parts: n % 2 ? ['Start relay', 'Overload protector'] : ['Start capacitor'],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'Running and pulling down',
      followUp: '',
    },
  }
}

const sensorFault: Scenario = (unit, n) => ({
  complaint: 'Display shows warm but the samples are frozen hard',
  symptoms: ['intermittent-cooling'],
  readings: [r('cabinetTemperature', (unit.design.cabinetC ?? -80) + 1, 'C'), r('setpointTemperature', unit.design.cabinetC ?? -80, 'C')],
  tests: [{ test: 'sensor-verification', stage: cabinetStage(unit), outcome: 'sensor-off' }],
  note: 'Reference probe read 9 K colder than the display.',
  close: {
    confirmedCauses: [{ cause: 'control-sensor-fault', stage: cabinetStage(unit) }],
    workDone: `Cabinet probe reading ${8 + (n % 3)} K warm; replaced probe, checked against a reference thermometer.`,
    parts: ['Cabinet temperature probe'],
    refrigerantTransactions: [],
    unitStateAtDeparture: 'Display agrees with reference within 1 K',
    followUp: '',
  },
})

const heatLoad: Scenario = (unit, n) => ({
  complaint: 'Slow to recover after loading; door left ajar reported',
  symptoms: ['slow-pulldown'],
  readings: base(unit, (unit.design.cabinetC ?? -20) + 10, n),
  tests: [{ test: 'door-and-load-check', stage: cabinetStage(unit), outcome: 'heat-load-problem' }],
  close: {
    confirmedCauses: [{ cause: 'high-heat-load', stage: cabinetStage(unit) }],
    workDone: 'Door gasket torn at the hinge side; replaced gasket. Advised staff to load warm product in batches.',
    parts: ['Door gasket'],
    refrigerantTransactions: [],
    unitStateAtDeparture: 'At setpoint',
    followUp: '',
  },
})

const wrongRefrigerant: Scenario = (unit) => {
  const s = heatStage(unit)
  const charge = unit.stages.find((x) => x.stage === s)?.chargeG ?? 500
  return {
    complaint: 'Poor cooling since a top-up by another contractor',
    symptoms: ['recently-serviced', 'refrigerant-label-mismatch', 'slow-pulldown'],
    readings: base(unit, (unit.design.cabinetC ?? -20) + 12, 1),
    tests: [{ test: 'refrigerant-identification', stage: s, outcome: 'mismatch-or-mixture' }],
    close: {
      confirmedCauses: [{ cause: 'wrong-refrigerant', stage: s }],
      workDone: 'Identifier showed a mixture. Recovered the whole charge into a marked mixed-gas cylinder, evacuated, charged with the nameplate refrigerant by weight.',
      parts: ['Filter drier'],
      refrigerantTransactions: [
        { stage: s, refrigerant: refrigerantOf(unit, s), grams: round(charge * 0.9), direction: 'recovered', cylinder: 'REC-MIXED-07' },
        { stage: s, refrigerant: refrigerantOf(unit, s), grams: charge, direction: 'added', cylinder: `CYL-${refrigerantOf(unit, s)}-501` },
      ],
      unitStateAtDeparture: 'Pulling down normally',
      followUp: 'Label the unit with the refrigerant and charge.',
    },
  }
}

/** Per unit, the causes its history is drawn from (weights by repetition). */
const CASCADE_MIX: Scenario[] = [lowStageLeak, lowStageBlockage('moisture-freeze'), lowStageLeak, condenserAirflow, lowStageBlockage('oil-return-blocked'), compressorElectrical, sensorFault, lowStageBlockage('restriction')]
const SINGLE_MIX: Scenario[] = [condenserAirflow, lowStageLeak, heatLoad, sensorFault, wrongRefrigerant, compressorElectrical]

/** The demo's closed history for one unit: `count` cases, deterministic. */
export function historyFor(unit: UnitDto, count: number, offset: number): DemoCase[] {
  const mix = unit.kind === 'cascade' ? CASCADE_MIX : SINGLE_MIX
  return Array.from({ length: count }, (_, i) => mix[(i + offset) % mix.length]!(unit, i + offset))
}

/** An open case in progress: readings taken, the standing-pressure check still to do. */
export function openCaseFor(unit: UnitDto, n: number): DemoCase {
  const full = unit.kind === 'cascade' ? lowStageLeak(unit, n) : condenserAirflow(unit, n)
  return { ...full, readings: full.readings.filter((x) => x.quantity !== 'standingPressure'), tests: [], close: undefined, note: 'Customer moved the samples to the backup freezer.' }
}
