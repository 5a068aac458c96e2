// The invented service history of the demo: closed cases with readings, tests, findings and refrigerant
// transactions, and two open cases. Each case is built from a fault the scenario puts into the unit:
// its readings come from the diagnosis domain's operating-state module (saturation curves and standing
// charges of the property module, shown in the gauges' units at the site's altitude), so a leaking stage
// really stands low and a choked condenser really runs a high head; the confirmed cause is that fault,
// never what a ranking said. Tests done while repairing carry the repair phase.
import type { CloseInput } from '#server/domain/cases/case-changes'
import type { LearnedCount } from '#server/domain/diagnosis/priors'
import { healthyState, readingsForState, STOPPED_STAGE, withState, type Presentation, type StateChange, type UnitShape, type UnitState } from '#server/domain/diagnosis/operating-state'
import type { CasePhase, Reading, Stage, Symptom, TestSlug } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'
import { isDesignation, standingPressureFromCharge } from '#shared/utils/properties'
import { DEMO_ORGANISATIONS } from './demo-equipment'

export interface DemoCase {
  complaint: string
  symptoms: Symptom[]
  readings: Reading[]
  tests: { test: TestSlug; stage: Stage; outcome: string; phase?: CasePhase }[]
  note?: string
  close?: CloseInput
  /** The confirmation rests on a definitive test or repair (only those may teach the starting odds). */
  definitive?: boolean
}

/** What a demo case needs of its unit: the unit register's record, or the demo equipment before it is stored. */
export type DemoUnit = Pick<UnitDto, 'name' | 'kind' | 'equipmentClass' | 'siteAltitudeM' | 'design'> & { stages: (UnitShape['stages'][number] & Pick<UnitDto['stages'][number], 'chargeG'>)[] }

type Scenario = (unit: DemoUnit, n: number) => DemoCase

const AMBIENT = [21, 23, 19, 24, 22, 20]
const round = (x: number, d = 0) => Math.round(x * 10 ** d) / 10 ** d
const ambientOf = (n: number) => AMBIENT[n % AMBIENT.length] as number
const cabinetStage = (unit: DemoUnit): Stage => (unit.kind === 'cascade' ? 'low' : 'single')
const heatStage = (unit: DemoUnit): Stage => (unit.kind === 'cascade' ? 'high' : 'single')
const designCabinet = (unit: DemoUnit) => unit.design.cabinetC ?? (unit.kind === 'cascade' ? -80 : -20)
const designHx = (unit: DemoUnit) => unit.design.cascadeHxC ?? -30
const stageOf = (unit: DemoUnit, stage: Stage) => unit.stages.find((s) => s.stage === stage)
const refrigerantOf = (unit: DemoUnit, stage: Stage) => stageOf(unit, stage)?.refrigerant ?? 'R290'
const chargeOf = (unit: DemoUnit, stage: Stage, fallback: number) => stageOf(unit, stage)?.chargeG ?? fallback

/** Gauges as the team reads them: psig where the site is high up, barg elsewhere, kPa on the test house's loggers. */
function presentation(unit: DemoUnit, n: number): Presentation {
  const pressure = unit.siteAltitudeM > 1000 ? 'psig' : n % 3 === 2 ? 'kPa' : 'barg'
  return { pressure, altitudeM: unit.siteAltitudeM, noiseSeed: 1000 + n }
}

function readings(unit: DemoUnit, state: UnitState, n: number): Reading[] {
  return readingsForState(unit, state, presentation(unit, n))
}

/** Healthy state with a fault's changes, in the room of case n. */
function faulty(unit: DemoUnit, n: number, change: StateChange): UnitState {
  return withState(healthyState(unit, ambientOf(n)), change)
}

/** The warm-cabinet state of a cascade whose high stage has lost capacity: heat exchanger and low-stage head up. */
function highStageStruggling(unit: DemoUnit, hxRiseK: number, high: StateChange['high']): StateChange {
  const cabinet = designCabinet(unit) + 1.5 * hxRiseK
  return { cabinet, cascadeHx: designHx(unit) + hxRiseK, high, low: { sst: cabinet - 14, sct: designHx(unit) + 5 + hxRiseK, currentPct: 105 } }
}

// ------------------------------------------------------------------ scenarios

const stageLeak: Scenario = (unit, n) => {
  const s = cabinetStage(unit)
  const cabinet = designCabinet(unit) + (unit.kind === 'cascade' ? 30 : 12) + (n % 5)
  const left = 0.4 + (n % 3) * 0.1
  const change: StateChange =
    unit.kind === 'cascade'
      ? { cabinet, cascadeHx: designHx(unit) - 2, low: { sst: designCabinet(unit) - 19, sct: designHx(unit) + 1, superheat: 65, subcooling: 0.5, currentPct: 68, standingFraction: left } }
      : { cabinet, single: { sst: designCabinet(unit) - 18, sct: ambientOf(n) + 10, superheat: 20, subcooling: 0.5, currentPct: 70, dischargeSuperheat: 70 } }
  const grams = round(chargeOf(unit, s, 200) * (1 - left))
  return {
    complaint: n % 2 ? 'Temperature alarm overnight; cabinet drifting up' : `Will not get below ${cabinet} °C after a door-open event`,
    symptoms: ['not-cooling', 'warming-over-days'],
    readings: readings(unit, faulty(unit, n, change), n),
    tests: [
      { test: 'leak-search', stage: s, outcome: 'leak-found' },
      { test: 'nitrogen-pressure-test', stage: s, outcome: 'holds', phase: 'repair' },
      { test: 'vacuum-decay-test', stage: s, outcome: 'holds', phase: 'repair' },
    ],
    close: {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: s }],
      workDone: `Leak found at ${['a flare nut on the drier', 'the service valve core', 'a cracked capillary joint', 'a brazed joint at the evaporator inlet'][n % 4]}; repaired under a dry-nitrogen purge, nitrogen pressure test held, evacuated to 250 microns, charged by weight.`,
      parts: ['Filter drier', n % 2 ? 'Valve core' : 'Flare nut'],
      refrigerantTransactions: [{ stage: s, refrigerant: refrigerantOf(unit, s), grams, direction: 'added', cylinder: `CYL-${refrigerantOf(unit, s)}-${100 + n}` }],
      unitStateAtDeparture: `Pulling down; cabinet ${round(designCabinet(unit) + 20)} °C after 90 min`,
      followUp: 'Check the cabinet log in one week.',
    },
    definitive: true,
  }
}

const lowStageBlockage = (cause: 'moisture-freeze' | 'oil-return-blocked' | 'restriction'): Scenario => (unit, n) => {
  const s = cabinetStage(unit)
  const cabinet = designCabinet(unit) + 25
  const td = unit.kind === 'cascade' ? 12 : 10
  const running: StateChange = unit.kind === 'cascade'
    ? { cabinet, low: { sst: designCabinet(unit) - td - 9, superheat: 70, subcooling: 10, currentPct: 72, standingFraction: 0.98 } }
    : { cabinet, single: { sst: designCabinet(unit) - td - 9, superheat: 17, subcooling: 11, currentPct: 72 } }
  const test: DemoCase['tests'][number] =
    cause === 'moisture-freeze' ? { test: 'warm-capillary-test', stage: s, outcome: 'flow-returns' }
      : cause === 'oil-return-blocked' ? { test: 'oil-return-line-check', stage: s, outcome: 'no-return' }
        : { test: 'restriction-temperature-drop', stage: s, outcome: 'marked-drop' }
  const charge = chargeOf(unit, s, 200)
  return {
    complaint: 'Cools for a few hours after a restart, then the cabinet warms again',
    symptoms: cause === 'moisture-freeze' ? ['intermittent-cooling', 'recently-serviced'] : cause === 'oil-return-blocked' ? ['intermittent-cooling', 'noisy-compressor'] : ['slow-pulldown', 'frost-on-capillary'],
    readings: readings(unit, faulty(unit, n, running), n),
    tests: [test, { test: 'vacuum-decay-test', stage: s, outcome: cause === 'moisture-freeze' ? 'levels-off' : 'holds', phase: 'repair' }],
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
    definitive: true,
  }
}

const condenserAirflow: Scenario = (unit, n) => {
  const s = heatStage(unit)
  const airIn = 27
  const headUp: StageState = { sct: airIn + 15 + 15 + (n % 4), subcooling: 5, currentPct: 118 }
  const change: StateChange = unit.kind === 'cascade'
    ? { ...highStageStruggling(unit, 10, { ...headUp, sst: designHx(unit) }), ambient: airIn, airIn, airOut: airIn + 17 }
    : { ambient: airIn, airIn, airOut: airIn + 17, cabinet: designCabinet(unit) + 8, single: { ...headUp, sst: designCabinet(unit) - 6 } }
  return {
    complaint: 'Warm in the afternoons; the room gets hot',
    symptoms: ['slow-pulldown'],
    readings: readings(unit, faulty(unit, n, change), n),
    tests: [{ test: 'condenser-inspection', stage: s, outcome: 'fouled-or-fan-fault' }],
    close: {
      confirmedCauses: [{ cause: 'condenser-airflow', stage: s }],
      workDone: n % 2 ? 'Condenser coil matted with dust; cleaned with brush and vacuum, checked fan.' : 'Condenser fan motor seized; replaced motor, cleaned coil.',
      parts: n % 2 ? [] : ['Condenser fan motor'],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'Discharge pressure back to normal',
      followUp: 'Put the condenser on the quarterly cleaning round.',
    },
    definitive: true,
  }
}

type StageState = NonNullable<UnitState['high']>

const compressorElectrical: Scenario = (unit, n) => {
  const s = heatStage(unit)
  const change: StateChange = unit.kind === 'cascade'
    ? { cabinet: designCabinet(unit) + 45, cascadeHx: 10, airOut: ambientOf(n), high: { ...STOPPED_STAGE, running: true }, low: STOPPED_STAGE }
    : { cabinet: designCabinet(unit) + 20, airOut: ambientOf(n), single: { ...STOPPED_STAGE, running: true } }
  return {
    complaint: 'Unit alarming; compressor clicks and stops',
    symptoms: ['compressor-tripping', 'not-cooling'],
    readings: readings(unit, faulty(unit, n, change), n),
    tests: [],
    close: {
      confirmedCauses: [{ cause: 'compressor-electrical', stage: s }],
      workDone: n % 2 ? 'Start relay burnt; replaced relay and overload.' : 'Start capacitor failed; replaced, checked windings to earth.',
      parts: n % 2 ? ['Start relay', 'Overload protector'] : ['Start capacitor'],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'Running and pulling down',
      followUp: '',
    },
    definitive: true,
  }
}

const probeFault: Scenario = (unit, n) => ({
  complaint: 'Display shows warm but the samples are frozen hard',
  symptoms: ['not-cooling'],
  readings: readings(unit, faulty(unit, n, { cabinet: designCabinet(unit) + 30 + (n % 3) }), n),
  tests: [{ test: 'sensor-verification', stage: cabinetStage(unit), outcome: 'sensor-off' }],
  note: 'Reference probe read the cabinet at its setpoint.',
  close: {
    confirmedCauses: [{ cause: 'control-sensor-fault', stage: cabinetStage(unit) }],
    workDone: `Cabinet probe reading ${30 + (n % 3)} K warm; replaced probe, checked against a reference thermometer.`,
    parts: ['Cabinet temperature probe'],
    refrigerantTransactions: [],
    unitStateAtDeparture: 'Display agrees with reference within 1 K',
    followUp: '',
  },
  definitive: true,
})

const heatLoad: Scenario = (unit, n) => {
  const s = cabinetStage(unit)
  const cabinet = designCabinet(unit) + 10
  const change: StateChange = unit.kind === 'cascade'
    ? { cabinet, runtime: 400, low: { sst: cabinet - 16, superheat: 55, currentPct: 105 } }
    : { cabinet, runtime: 300, single: { sst: cabinet - 14, superheat: 13, currentPct: 100 } }
  return {
    complaint: 'Slow to recover after loading; door left ajar reported',
    symptoms: ['slow-pulldown'],
    readings: readings(unit, faulty(unit, n, change), n),
    tests: [{ test: 'door-and-load-check', stage: s, outcome: 'heat-load-problem' }],
    close: {
      confirmedCauses: [{ cause: 'high-heat-load', stage: s }],
      workDone: 'Door gasket torn at the hinge side; replaced gasket. Advised staff to load warm product in batches.',
      parts: ['Door gasket'],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'At setpoint',
      followUp: '',
    },
    definitive: true,
  }
}

/** Refrigerant a wrong top-up most likely brought, for a nameplate one. */
const MIX_UP: Record<string, string> = { R404A: 'R22', R507A: 'R22', R134a: 'R290', R290: 'R1270', R22: 'R404A' }

const wrongRefrigerant: Scenario = (unit, n) => {
  const s = heatStage(unit)
  const nameplate = refrigerantOf(unit, s)
  const actual = MIX_UP[nameplate] ?? 'R22'
  const charge = chargeOf(unit, s, 500)
  const stopped: StageState = isDesignation(actual) ? { actual, standingFraction: 1, running: false } : { running: false }
  return {
    complaint: 'Poor cooling since a top-up by another contractor',
    symptoms: ['recently-serviced', 'slow-pulldown'],
    readings: readings(unit, { ambient: ambientOf(n), cabinet: designCabinet(unit) + 12, ...(s === 'high' ? { high: stopped } : { single: stopped }) }, n),
    tests: [{ test: 'refrigerant-identification', stage: s, outcome: 'mismatch-or-mixture' }],
    close: {
      confirmedCauses: [{ cause: 'wrong-refrigerant', stage: s }],
      workDone: `Identifier showed ${actual} in a ${nameplate} system. Recovered the whole charge into a marked mixed-gas cylinder, evacuated, charged with ${nameplate} by weight.`,
      parts: ['Filter drier'],
      refrigerantTransactions: [
        { stage: s, refrigerant: nameplate, grams: round(charge * 0.9), direction: 'recovered', cylinder: 'REC-MIXED-07' },
        { stage: s, refrigerant: nameplate, grams: charge, direction: 'added', cylinder: `CYL-${nameplate}-501` },
      ],
      unitStateAtDeparture: 'Pulling down normally',
      followUp: 'Label the unit with the refrigerant and charge.',
    },
    definitive: true,
  }
}

const evaporatorAirflow: Scenario = (unit, n) => {
  const cabinet = designCabinet(unit) + 8
  const sst = designCabinet(unit) - 20
  return {
    complaint: 'Room warm although the unit runs all the time',
    symptoms: ['not-cooling'],
    readings: readings(unit, faulty(unit, n, { cabinet, single: { sst, superheat: 2, subcooling: 5, currentPct: 88, evaporator: sst + 1 } }), n),
    tests: [{ test: 'door-and-load-check', stage: 'single', outcome: 'normal' }],
    close: {
      confirmedCauses: [{ cause: 'evaporator-airflow', stage: 'single' }],
      workDone: 'Evaporator fan motor seized and the coil iced solid; defrosted, replaced the fan motor.',
      parts: ['Evaporator fan motor'],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'Air moving, coil clear, pulling down',
      followUp: 'Check the defrost timer at the next service.',
    },
    definitive: true,
  }
}

/** A slow leak topped up without finding it: the cause is recorded, but nothing proved it. */
const leakNotFound: Scenario = (unit, n) => {
  const s = heatStage(unit)
  const change: StateChange = unit.kind === 'cascade'
    ? highStageStruggling(unit, 8, { sst: designHx(unit) - 12, superheat: 18, subcooling: 1, currentPct: 72 })
    : { cabinet: designCabinet(unit) + 7, single: { sst: designCabinet(unit) - 16, superheat: 16, subcooling: 1, currentPct: 75 } }
  return {
    complaint: 'Cabinet a few degrees warm at the weekly check',
    symptoms: ['warming-over-days'],
    readings: readings(unit, faulty(unit, n, change), n),
    tests: [{ test: 'leak-search', stage: s, outcome: 'none-found' }],
    close: {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: s }],
      workDone: 'No leak found with the detector or bubble solution. Topped up by weight to the nameplate charge; fitted leak-detection dye.',
      parts: [],
      refrigerantTransactions: [{ stage: s, refrigerant: refrigerantOf(unit, s), grams: round(chargeOf(unit, s, 400) * 0.15), direction: 'added', cylinder: `CYL-${refrigerantOf(unit, s)}-${600 + n}` }],
      unitStateAtDeparture: 'At setpoint',
      followUp: 'Look for dye at the next visit.',
    },
    definitive: false,
  }
}

const highStageLeak: Scenario = (unit, n) => {
  const change = highStageStruggling(unit, 12, { sst: designHx(unit) - 14, sct: ambientOf(n) + 9, superheat: 20, subcooling: 0.5, currentPct: 65 })
  const s: Stage = 'high'
  return {
    complaint: 'Freezer alarm; high stage sounds different',
    symptoms: ['not-cooling', 'oil-at-fitting'],
    readings: readings(unit, faulty(unit, n, change), n),
    tests: [
      { test: 'leak-search', stage: s, outcome: 'leak-found' },
      { test: 'nitrogen-pressure-test', stage: s, outcome: 'holds', phase: 'repair' },
    ],
    close: {
      confirmedCauses: [{ cause: 'refrigerant-leak', stage: s }],
      workDone: 'Oily flare at the high-stage drier; replaced the drier with brazed joints under a dry-nitrogen purge, pressure tested, evacuated, charged by weight.',
      parts: ['Filter drier'],
      refrigerantTransactions: [{ stage: s, refrigerant: refrigerantOf(unit, s), grams: round(chargeOf(unit, s, 500) * 0.5), direction: 'added', cylinder: `CYL-${refrigerantOf(unit, s)}-${700 + n}` }],
      unitStateAtDeparture: 'Cascade heat exchanger back at design',
      followUp: '',
    },
    definitive: true,
  }
}

const expansionTank: Scenario = (unit, n) => {
  const low = stageOf(unit, 'low')
  const d = low?.refrigerant ?? 'R170'
  const standing = low?.chargeG && low.volumeL && isDesignation(d)
    ? standingPressureFromCharge({ designation: d, ambientC: ambientOf(n), volumeL: low.volumeL * 0.6, chargeG: low.chargeG }).pressureKpa
    : undefined
  return {
    complaint: 'Low stage trips whenever the freezer restarts after a stop',
    symptoms: ['compressor-tripping', 'intermittent-cooling', 'recently-serviced'],
    readings: readings(unit, faulty(unit, n, { cabinet: designCabinet(unit) + 2, low: standing ? { standingKpa: standing } : {} }), n),
    tests: [{ test: 'expansion-tank-check', stage: 'low', outcome: 'tank-fault-found' }],
    close: {
      confirmedCauses: [{ cause: 'expansion-tank-fault', stage: 'low' }],
      workDone: 'Expansion tank isolation valve left shut after the last service; opened it with the stage cold, checked the standing pressure after a full warm-up.',
      parts: [],
      refrigerantTransactions: [],
      unitStateAtDeparture: 'Restarted twice from warm without a trip',
      followUp: 'Seal the tank valve caps.',
    },
    definitive: true,
  }
}

/** Per unit kind, the faults its history is drawn from (weights by repetition). */
const CASCADE_MIX: Scenario[] = [stageLeak, lowStageBlockage('moisture-freeze'), condenserAirflow, stageLeak, lowStageBlockage('oil-return-blocked'), compressorElectrical, probeFault, lowStageBlockage('restriction'), highStageLeak, expansionTank, leakNotFound]
const SINGLE_MIX: Scenario[] = [condenserAirflow, stageLeak, heatLoad, probeFault, wrongRefrigerant, compressorElectrical, evaporatorAirflow, leakNotFound]

/** The demo's closed history for one unit: `count` cases, deterministic. */
export function historyFor(unit: DemoUnit, count: number, offset: number): DemoCase[] {
  const mix = unit.kind === 'cascade' ? CASCADE_MIX : SINGLE_MIX
  return Array.from({ length: count }, (_, i) => (mix[(i + offset) % mix.length] as Scenario)(unit, i + offset))
}

/** An open case in progress: running readings taken, the standing-pressure check still to do. */
export function openCaseFor(unit: DemoUnit, n: number): DemoCase {
  const full = unit.kind === 'cascade' ? stageLeak(unit, n) : condenserAirflow(unit, n)
  return { ...full, readings: full.readings.filter((x) => x.quantity !== 'standingPressure'), tests: [], close: undefined, definitive: undefined, note: 'Customer moved the samples to the backup freezer.' }
}

/** Closed cases per unit, as the seeder stores them: four each when the organisation has eight units or more. */
export function casesPerUnit(unitCount: number): number {
  return unitCount >= 8 ? 4 : 2
}

/**
 * The confirmed causes the seeder gives an organisation of the demo, per equipment class, computed in
 * process from the same generator and in the order the register lists its units (customer, then name).
 */
export function demoHistoryCounts(slug = 'rimecase-demo'): Map<string, LearnedCount[]> {
  const org = DEMO_ORGANISATIONS.find((o) => o.slug === slug)
  const units = (org?.customers ?? [])
    .flatMap((c) => c.sites.flatMap((site) => site.units.map((u) => ({ customer: c.name, unit: u, altitude: site.altitudeM }))))
    .sort((a, b) => a.customer.localeCompare(b.customer) || a.unit.name.localeCompare(b.unit.name))
  const perUnit = casesPerUnit(units.length)
  const counts = new Map<string, Map<string, LearnedCount>>()
  units.forEach(({ unit, altitude }, u) => {
    const shape: DemoUnit = {
      name: unit.name,
      kind: unit.kind,
      equipmentClass: unit.equipmentClass,
      siteAltitudeM: altitude,
      design: { cabinetC: unit.designCabinetC, cascadeHxC: unit.designCascadeHxC },
      stages: unit.stages,
    }
    const byCause = counts.get(unit.equipmentClass) ?? new Map<string, LearnedCount>()
    counts.set(unit.equipmentClass, byCause)
    for (const demo of historyFor(shape, perUnit, u)) {
      for (const c of demo.close?.confirmedCauses ?? []) {
        const key = `${c.cause}@${c.stage ?? ''}@${demo.definitive ? 1 : 0}`
        const entry = byCause.get(key) ?? { cause: c.cause, ...(c.stage ? { stage: c.stage } : {}), count: 0, definitive: demo.definitive === true }
        entry.count++
        byCause.set(key, entry)
      }
    }
  })
  return new Map([...counts].map(([cls, byCause]) => [cls, [...byCause.values()]]))
}
