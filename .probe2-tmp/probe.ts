/**
 * Independent outside probe of the diagnosis ranking (tester 2). Scenarios written from trade knowledge;
 * all pressures worked out with the project's property module. Invented demo data only.
 * Run: cd /work/main && npx tsx --tsconfig tsconfig.scripts.json .probe2-tmp/probe.ts
 */
import { loadKnowledgeBaseFromDirectory } from '../server/domain/diagnosis/content-loader'
import { rankDiagnosis } from '../server/domain/diagnosis/rank'
import type { RankRequest, Reading, RankResponse, TestResult, Stage, Cause, StageConfig } from '../shared/types/diagnosis'
import type { EquipmentClass } from '../shared/types/equipment'
import type { Designation } from '../shared/utils/properties/index'
import { saturationPressure, standingPressureFromCharge, atmosphericPressureAtAltitude, fromKpaAbs } from '../shared/utils/properties/index'

const kb = { ...loadKnowledgeBaseFromDirectory(process.cwd() + '/content-src'), version: { id: 'x', label: 'seed', status: 'draft' as const } }

type PU = 'kPa' | 'kPag' | 'bar' | 'barg' | 'psia' | 'psig' | 'MPa'
const STEP: Record<PU, number> = { kPa: 1, kPag: 1, bar: 0.01, barg: 0.05, psia: 0.5, psig: 0.5, MPa: 0.001 }
const round = (v: number, s: number) => Math.round(v / s) * s
const fix = (v: number) => Number(v.toFixed(4))
const dew = (d: Designation, t: number) => saturationPressure(d, t).dewKpa
const bub = (d: Designation, t: number) => saturationPressure(d, t).bubbleKpa
const P = (kpaAbs: number, u: PU, atm = 101.325) => fix(round(fromKpaAbs(kpaAbs, u, atm), STEP[u]))
const standing = (d: Designation, ambientC: number, volumeL: number, chargeG: number) => standingPressureFromCharge({ designation: d, ambientC, volumeL, chargeG }).pressureKpa

function r(quantity: Reading['quantity'], value: number | boolean, unit: Reading['unit'], stage?: Stage, phase?: Reading['phase']): Reading {
  const x: Reading = { quantity, value, unit }
  if (stage) x.stage = stage
  if (phase) x.phase = phase
  return x
}
const t = (test: TestResult['test'], stage: Stage, outcome: string, phase?: TestResult['phase']): TestResult => (phase ? { test, stage, outcome, phase } : { test, stage, outcome })

/** Running readings of one stage from a state: saturated suction (dew) and condensing (bubble) temperatures. */
interface Run { d: Designation; stage: Stage; sst: number; sh?: number; sct?: number; sc?: number; td?: number; amps?: number; u: PU; atm?: number }
function running(s: Run): Reading[] {
  const out: Reading[] = [r('compressorRunning', true, 'bool', s.stage)]
  out.push(r('suctionPressure', P(dew(s.d, s.sst), s.u, s.atm), s.u, s.stage))
  if (s.sh !== undefined) out.push(r('suctionTemperature', s.sst + s.sh, 'C', s.stage))
  if (s.sct !== undefined) out.push(r('dischargePressure', P(bub(s.d, s.sct), s.u, s.atm), s.u, s.stage))
  if (s.sct !== undefined && s.sc !== undefined) out.push(r('liquidLineTemperature', s.sct - s.sc, 'C', s.stage))
  if (s.td !== undefined) out.push(r('dischargeTemperature', s.td, 'C', s.stage))
  if (s.amps !== undefined) out.push(r('compressorCurrent', s.amps, 'A', s.stage))
  return out
}

interface Scenario {
  id: string
  title: string
  expect: { cause: Cause; stage?: Stage }
  why: string
  cls: EquipmentClass
  req: RankRequest
}

const single = (refrigerant: Designation, meteringDevice: 'capillary' | 'expansion-valve', cabinetC: number, ratedCurrentA: number, extra: Partial<StageConfig> = {}): RankRequest['unit'] => ({
  kind: 'single-stage',
  stages: [{ stage: 'single', refrigerant, meteringDevice, ratedCurrentA, ...extra }],
  design: { cabinetC },
})

// ULT cascade: high R404A, low R1150 (ethylene) 250 g in 9.5 L, cascade HX design -35, cabinet -80.
const ULT_LOW_CHARGE = 250, ULT_LOW_VOL = 9.5, ULT_REF_AMB = 21
const ultUnit = (): RankRequest['unit'] => ({
  kind: 'cascade',
  stages: [
    { stage: 'high', refrigerant: 'R404A', ratedCurrentA: 6, chargeG: 900, meteringDevice: 'capillary' },
    {
      stage: 'low', refrigerant: 'R1150', ratedCurrentA: 5, chargeG: ULT_LOW_CHARGE, volumeL: ULT_LOW_VOL,
      referenceStandingPressureKpa: Math.round(standing('R1150', ULT_REF_AMB, ULT_LOW_VOL, ULT_LOW_CHARGE)), referenceAmbientC: ULT_REF_AMB, meteringDevice: 'capillary',
    },
  ],
  design: { cabinetC: -80, cascadeHxC: -35 },
})

const S: Scenario[] = []
const add = (s: Scenario) => S.push(s)

// ----------------------------------------------------------------- single-stage commercial, R404A with TXV
add({
  id: 'S01', title: 'R404A cold room TXV, slow leak (psig)', cls: 'cold-room',
  expect: { cause: 'refrigerant-leak', stage: 'single' },
  why: 'low suction + very high superheat + ~1 K subcooling + low head + low amps: short of charge, not a valve (valve starve keeps subcooling)',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['warming-over-days', 'slow-pulldown'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -38, sh: 28, sct: 38, sc: 1, td: 118, amps: 5.0, u: 'psig' }),
      r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', -8, 'C'),
    ],
  },
})
add({
  id: 'S02', title: 'R404A cold room TXV, valve starving (power head lost charge) (barg)', cls: 'cold-room',
  expect: { cause: 'expansion-valve-underfeeding', stage: 'single' },
  why: 'low suction + high superheat with normal head and HIGH subcooling (liquid held back in condenser) = valve starving; restriction is the honest runner-up',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['slow-pulldown'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -40, sh: 25, sct: 44, sc: 11, td: 112, amps: 5.2, u: 'barg' }),
      r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', -10, 'C'),
    ],
  },
})
add({
  id: 'S03', title: 'R404A cold room TXV, valve flooding (bulb loose) (kPag)', cls: 'cold-room',
  expect: { cause: 'expansion-valve-overfeeding', stage: 'single' },
  why: 'superheat ~1 K, suction slightly high, low discharge superheat (liquid floodback), noisy compressor; head and subcooling normal so not overcharge',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['noisy-compressor', 'slow-pulldown'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -27, sh: 1, sct: 45, sc: 5, td: 56, amps: 7.6, u: 'kPag' }),
      r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', -15, 'C'),
    ],
  },
})
// ----------------------------------------------------------------- R134a capillary freezer
add({
  id: 'S04', title: 'R134a capillary freezer, drier blocked + marked drop across drier (psig)', cls: 'freezer',
  expect: { cause: 'restriction', stage: 'single' },
  why: 'suction in vacuum, huge superheat, high subcooling (liquid stacked in condenser), low amps, and a measured >3 K drop across the drier',
  req: {
    unit: single('R134a', 'capillary', -20, 2.0), symptoms: ['not-cooling'],
    readings: [
      ...running({ d: 'R134a', stage: 'single', sst: -40, sh: 38, sct: 38, sc: 12, td: 95, amps: 1.1, u: 'psig' }),
      r('condenserAirInTemperature', 25, 'C'), r('cabinetTemperature', -4, 'C'),
    ],
    testResults: [t('restriction-temperature-drop', 'single', 'marked-drop')],
  },
})
add({
  id: 'S05', title: 'R134a capillary freezer, same readings as S04 but no drier test yet', cls: 'freezer',
  expect: { cause: 'restriction', stage: 'single' },
  why: 'readings alone: high subcooling with starving evaporator separates blockage from leak; moisture is the runner-up',
  req: {
    unit: single('R134a', 'capillary', -20, 2.0), symptoms: ['not-cooling'],
    readings: [
      ...running({ d: 'R134a', stage: 'single', sst: -40, sh: 38, sct: 38, sc: 12, td: 95, amps: 1.1, u: 'psig' }),
      r('condenserAirInTemperature', 25, 'C'), r('cabinetTemperature', -4, 'C'),
    ],
  },
})
add({
  id: 'S06', title: 'R134a capillary freezer, moisture freezing at capillary outlet after service', cls: 'freezer',
  expect: { cause: 'moisture-freeze', stage: 'single' },
  why: 'intermittent cooling after service, starved-evaporator readings, and warming the capillary outlet brings flow back',
  req: {
    unit: single('R134a', 'capillary', -20, 2.0), symptoms: ['intermittent-cooling', 'recently-serviced'],
    readings: [
      ...running({ d: 'R134a', stage: 'single', sst: -44, sh: 40, sct: 36, sc: 10, td: 90, amps: 1.1, u: 'psig' }),
      r('condenserAirInTemperature', 25, 'C'), r('cabinetTemperature', -11, 'C'),
    ],
    testResults: [t('warm-capillary-test', 'single', 'flow-returns')],
  },
})
// ----------------------------------------------------------------- R290 capillary
add({
  id: 'S07', title: 'R290 capillary freezer, overcharged at last service (barg)', cls: 'freezer',
  expect: { cause: 'overcharge', stage: 'single' },
  why: 'suction high, superheat ~1 K, head 12 K high, subcooling 14 K, amps 118 %, just serviced',
  req: {
    unit: single('R290', 'capillary', -25, 3.0), symptoms: ['slow-pulldown', 'recently-serviced'],
    readings: [
      ...running({ d: 'R290', stage: 'single', sst: -25, sh: 1, sct: 52, sc: 14, td: 64, amps: 3.55, u: 'barg' }),
      r('condenserAirInTemperature', 25, 'C'), r('cabinetTemperature', -17, 'C'),
    ],
  },
})
add({
  id: 'S08', title: 'R290 capillary freezer, condenser fan stopped, tripping on overload', cls: 'freezer',
  expect: { cause: 'condenser-airflow', stage: 'single' },
  why: 'condensing 33 K above air-in with normal subcooling, amps 120 %, overload trips; suction only slightly high',
  req: {
    unit: single('R290', 'capillary', -25, 3.0), symptoms: ['compressor-tripping', 'slow-pulldown'],
    readings: [
      ...running({ d: 'R290', stage: 'single', sst: -32, sh: 8, sct: 58, sc: 3, td: 112, amps: 3.6, u: 'bar' }),
      r('condenserAirInTemperature', 25, 'C'), r('condenserAirOutTemperature', 33, 'C'), r('cabinetTemperature', -19, 'C'),
    ],
  },
})
// ----------------------------------------------------------------- R410A process chiller, non-condensables
{
  const amb = 30
  const sat = bub('R410A', amb)
  add({
    id: 'S09', title: 'R410A process chiller TXV, air in circuit after a compressor change (psig)', cls: 'process-chiller',
    expect: { cause: 'non-condensables', stage: 'single' },
    why: 'head high with high apparent subcooling, and the equalised standing pressure sits ~11 % ABOVE the R410A curve at ambient (no refrigerant fits exactly)',
    req: {
      unit: single('R410A', 'expansion-valve', 5, 12), symptoms: ['recently-serviced'],
      readings: [
        ...running({ d: 'R410A', stage: 'single', sst: -4, sh: 6, sct: 53, sc: 16, td: 96, amps: 13.4, u: 'psig' }),
        r('condenserAirInTemperature', amb, 'C'), r('ambientTemperature', amb, 'C'), r('cabinetTemperature', 6, 'C'),
        r('standingPressure', P(sat * 1.11, 'psig'), 'psig', 'single'),
      ],
    },
  })
}
// ----------------------------------------------------------------- R744 small commercial cabinet
{
  const vol = 4, full = 1200
  const amb = 20
  add({
    id: 'S10', title: 'R744 cabinet, standing pressure low in MPa (gas-phase, charge lost) at 20 °C', cls: 'cold-room',
    expect: { cause: 'refrigerant-leak', stage: 'single' },
    why: 'design fill is two-phase at 20 °C; measured standing is in the gas region (charge ~500 g of 1200 g) = leak',
    req: {
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R744', chargeG: full, volumeL: vol, meteringDevice: 'expansion-valve', ratedCurrentA: 6 }], design: { cabinetC: -20 } },
      symptoms: ['warming-over-days'],
      readings: [r('ambientTemperature', amb, 'C'), r('standingPressure', P(standing('R744', amb, vol, 500), 'MPa'), 'MPa', 'single'), r('cabinetTemperature', -6, 'C')],
    },
  })
  add({
    id: 'S11', title: 'R744 cabinet, standing in a 34 °C plant room (supercritical) with charge lost', cls: 'cold-room',
    expect: { cause: 'refrigerant-leak', stage: 'single' },
    why: 'above critical the standing pressure measures the charge: 700 g of 1200 g gives a clearly lower pressure',
    req: {
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R744', chargeG: full, volumeL: vol, meteringDevice: 'expansion-valve', ratedCurrentA: 6 }], design: { cabinetC: -20 } },
      symptoms: ['warming-over-days', 'oil-at-fitting'],
      readings: [r('ambientTemperature', 34, 'C'), r('standingPressure', P(standing('R744', 34, vol, 700), 'MPa'), 'MPa', 'single'), r('cabinetTemperature', -6, 'C')],
    },
  })
}
// ----------------------------------------------------------------- altitude
{
  const atm = atmosphericPressureAtAltitude(2500)
  add({
    id: 'S12', title: 'R134a capillary freezer at 2500 m, healthy, readings in psig near 0 psig', cls: 'freezer',
    expect: { cause: 'no-refrigeration-fault' },
    why: 'every reading is a healthy state once gauges are read against 74.7 kPa; an uncorrected engine would see suction ~4 K high',
    req: {
      unit: single('R134a', 'capillary', -20, 2.0), site: { altitudeM: 2500 },
      readings: [
        ...running({ d: 'R134a', stage: 'single', sst: -30, sh: 8, sct: 40, sc: 5, td: 85, amps: 1.6, u: 'psig', atm }),
        r('condenserAirInTemperature', 25, 'C'), r('cabinetTemperature', -20, 'C'),
      ],
    },
  })
  const atm2 = atmosphericPressureAtAltitude(1800)
  add({
    id: 'S13', title: 'R404A capillary freezer at 1800 m, leak, suction in psig below 0', cls: 'freezer',
    expect: { cause: 'refrigerant-leak', stage: 'single' },
    why: 'suction deep, superheat huge, head low, subcooling ~0, oil at a flare, amps low',
    req: {
      unit: single('R404A', 'capillary', -25, 4.0), site: { altitudeM: 1800 }, symptoms: ['warming-over-days', 'oil-at-fitting'],
      readings: [
        ...running({ d: 'R404A', stage: 'single', sst: -43, sh: 35, sct: 32, sc: 0.5, td: 105, amps: 2.4, u: 'psig', atm: atm2 }),
        r('condenserAirInTemperature', 22, 'C'), r('cabinetTemperature', -12, 'C'),
      ],
    },
  })
}
// ----------------------------------------------------------------- wrong / mixed refrigerant
add({
  id: 'S14', title: 'R404A nameplate, charged with R22 (pressure BELOW the R404A curve, fits R22) (kPag)', cls: 'freezer',
  expect: { cause: 'wrong-refrigerant', stage: 'single' },
  why: 'standing at 24 °C and the running suction/evaporator pair both sit on the R22 curve, ~200 kPa under R404A',
  req: {
    unit: single('R404A', 'expansion-valve', -25, 4.0), symptoms: ['recently-serviced', 'slow-pulldown'],
    readings: [
      r('ambientTemperature', 24, 'C'), r('standingPressure', P(bub('R22', 24), 'kPag'), 'kPag', 'single'),
      r('compressorRunning', true, 'bool', 'single'),
      r('suctionPressure', P(dew('R22', -33), 'kPag'), 'kPag', 'single'), r('evaporatorTemperature', -33, 'C', 'single'),
      r('cabinetTemperature', -19, 'C'),
    ],
  },
})
add({
  id: 'S15', title: 'R134a nameplate, charged with R404A (pressure ABOVE the curve, fits R404A) (psig)', cls: 'freezer',
  expect: { cause: 'wrong-refrigerant', stage: 'single' },
  why: 'standing at 22 °C = R404A saturation (~ +80 % over R134a); a liquid-full or air explanation would not sit exactly on another curve',
  req: {
    unit: single('R134a', 'capillary', -20, 2.0), symptoms: ['recently-serviced', 'compressor-tripping'],
    readings: [r('ambientTemperature', 22, 'C'), r('standingPressure', P(bub('R404A', 22), 'psig'), 'psig', 'single'), r('cabinetTemperature', -12, 'C')],
  },
})
add({
  id: 'S16', title: 'R404A topped up with R134a (mixture, between the curves) + identifier flags mixture', cls: 'cold-room',
  expect: { cause: 'wrong-refrigerant', stage: 'single' },
  why: 'standing 950 kPa abs at 25 °C lies between R134a (665) and R404A (1255); identifier reports a mixture',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['recently-serviced', 'slow-pulldown'],
    readings: [r('ambientTemperature', 25, 'C'), r('standingPressure', 950, 'kPa', 'single'), r('cabinetTemperature', -11, 'C')],
    testResults: [t('refrigerant-identification', 'single', 'mismatch-or-mixture')],
  },
})
// ----------------------------------------------------------------- probes and controls
add({
  id: 'S17', title: 'R404A cold room, evaporator (defrost-termination) probe reading +4 °C while coil at -29 °C', cls: 'cold-room',
  expect: { cause: 'control-sensor-fault', stage: 'single' },
  why: 'pressures, superheat, head and current all healthy; only the evaporator probe disagrees with saturation by 33 K; long defrosts give intermittent cooling',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['intermittent-cooling'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -29, sh: 7, sct: 45, sc: 5, td: 92, amps: 6.9, u: 'barg' }),
      r('evaporatorTemperature', 4, 'C', 'single'), r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', -17, 'C'),
    ],
  },
})
add({
  id: 'S18', title: 'R290 freezer, control probe reads cold: compressor off (0 A) with cabinet at -9 vs -25', cls: 'freezer',
  expect: { cause: 'control-sensor-fault', stage: 'single' },
  why: 'compressor idle and equalised, not tripping, while cabinet far above target: not being called; compressor-electrical is the honest alternative',
  req: {
    unit: single('R290', 'capillary', -25, 3.0), symptoms: ['warming-over-days'],
    readings: [r('compressorRunning', false, 'bool', 'single'), r('compressorCurrent', 0, 'A', 'single'), r('cabinetTemperature', -9, 'C'), r('setpointTemperature', -25, 'C'), r('ambientTemperature', 23, 'C')],
  },
})
add({
  id: 'S19', title: 'S18 plus sensor-verification = sensor-off', cls: 'freezer',
  expect: { cause: 'control-sensor-fault', stage: 'single' },
  why: 'definitive probe finding should settle it',
  req: {
    unit: single('R290', 'capillary', -25, 3.0), symptoms: ['warming-over-days'],
    readings: [r('compressorRunning', false, 'bool', 'single'), r('compressorCurrent', 0, 'A', 'single'), r('cabinetTemperature', -9, 'C'), r('setpointTemperature', -25, 'C'), r('ambientTemperature', 23, 'C')],
    testResults: [t('sensor-verification', 'single', 'sensor-off')],
  },
})
// ----------------------------------------------------------------- oil logging, evaporator airflow, heat load, compressor
add({
  id: 'S20', title: 'R404A -30 °C store TXV, oil-logged evaporator', cls: 'cold-room',
  expect: { cause: 'oil-logging', stage: 'single' },
  why: 'suction low with NORMAL superheat (valve coping), cabinet 13 K above what evaporating explains, oil return line pulses (separator fine), fans OK by door/load check',
  req: {
    unit: single('R404A', 'expansion-valve', -30, 10), symptoms: ['slow-pulldown', 'warming-over-days'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -46, sh: 7, sct: 40, sc: 6, td: 108, amps: 7.0, u: 'psig' }),
      r('condenserAirInTemperature', 28, 'C'), r('cabinetTemperature', -23, 'C'),
    ],
    testResults: [t('oil-return-line-check', 'single', 'pulses-warm'), t('door-and-load-check', 'single', 'normal')],
  },
})
add({
  id: 'S21', title: 'R404A cold room TXV, evaporator fan motor dead', cls: 'cold-room',
  expect: { cause: 'evaporator-airflow', stage: 'single' },
  why: 'suction low with LOW superheat (no load on the coil), cabinet 22 K above evaporating, head and subcooling normal',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['not-cooling'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -40, sh: 2, sct: 41, sc: 5, td: 80, amps: 5.6, u: 'psig' }),
      r('condenserAirInTemperature', 28, 'C'), r('cabinetTemperature', -8, 'C'),
    ],
  },
})
add({
  id: 'S22', title: 'R404A cold room TXV, door left ajar / warm product, running 10 h', cls: 'cold-room',
  expect: { cause: 'high-heat-load', stage: 'single' },
  why: 'suction HIGH, superheat highish, head high, amps above rated, cabinet warm with long run: everything loaded, nothing starving',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['slow-pulldown'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -21, sh: 14, sct: 51, sc: 5, td: 100, amps: 8.8, u: 'psig' }),
      r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', -4, 'C'), r('runtime', 600, 'min'),
    ],
  },
})
add({
  id: 'S23', title: 'R404A cold room TXV, worn compressor valves', cls: 'cold-room',
  expect: { cause: 'compressor-inefficient', stage: 'single' },
  why: 'suction high AND head low (ratio collapsed), amps low, discharge hot for the ratio, noisy',
  req: {
    unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['slow-pulldown', 'noisy-compressor'],
    readings: [
      ...running({ d: 'R404A', stage: 'single', sst: -20, sh: 12, sct: 37, sc: 4, td: 108, amps: 5.0, u: 'psig' }),
      r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', -10, 'C'),
    ],
  },
})
add({
  id: 'S24', title: 'R134a capillary freezer, two symptoms: tripping + noisy, locked-rotor current on start', cls: 'freezer',
  expect: { cause: 'compressor-electrical', stage: 'single' },
  why: 'compressor hums and trips, draws 3x rated while trying, not running; system equalised: start relay/winding fault',
  req: {
    unit: single('R134a', 'capillary', -20, 2.0), symptoms: ['compressor-tripping', 'noisy-compressor'],
    readings: [r('compressorRunning', false, 'bool', 'single'), r('cabinetTemperature', -3, 'C'), r('ambientTemperature', 24, 'C')],
    testResults: [t('compressor-current-check', 'single', 'high')],
  },
})
add({
  id: 'S25', title: 'R134a freezer, standing-pressure-check low then nitrogen test falls', cls: 'freezer',
  expect: { cause: 'refrigerant-leak', stage: 'single' },
  why: 'two leak outcomes in order, nitrogen fall is definitive',
  req: {
    unit: single('R134a', 'capillary', -20, 2.0), symptoms: ['warming-over-days'],
    testResults: [t('standing-pressure-check', 'single', 'low'), t('nitrogen-pressure-test', 'single', 'falls')],
  },
})
add({
  id: 'S26', title: 'R290 freezer healthy, noisy partial readings (suction + discharge temp + cabinet only)', cls: 'freezer',
  expect: { cause: 'no-refrigeration-fault' },
  why: 'cabinet 1 K off target, suction at design, plausible discharge temp: nothing wrong',
  req: {
    unit: single('R290', 'capillary', -25, 3.0),
    readings: [r('compressorRunning', true, 'bool', 'single'), r('suctionPressure', P(dew('R290', -34.2), 'barg'), 'barg', 'single'), r('dischargeTemperature', 78.5, 'C', 'single'), r('cabinetTemperature', -24.1, 'C'), r('setpointTemperature', -25, 'C')],
  },
})
// ----------------------------------------------------------------- ULT cascade (R404A / R1150)
{
  const amb = 22
  const expected = standing('R1150', amb, ULT_LOW_VOL, ULT_LOW_CHARGE)
  const leaked = standing('R1150', amb, ULT_LOW_VOL, 160)
  add({
    id: 'S27', title: 'ULT low-stage leak, only a leak-search leak-found (cabinet warm)', cls: 'ult-freezer',
    expect: { cause: 'refrigerant-leak', stage: 'low' },
    why: 'one definitive outcome on the low stage should carry the ranking',
    req: { unit: ultUnit(), symptoms: ['warming-over-days'], readings: [r('cabinetTemperature', -62, 'C')], testResults: [t('leak-search', 'low', 'leak-found')] },
  })
  add({
    id: 'S28', title: 'ULT low-stage leak: standing reading low (64 % charge) in MPa, as reading only', cls: 'ult-freezer',
    expect: { cause: 'refrigerant-leak', stage: 'low' },
    why: 'R1150 is supercritical at 22 °C: standing pressure measures the charge; 160 g of 250 g',
    req: { unit: ultUnit(), symptoms: ['warming-over-days'], readings: [r('ambientTemperature', amb, 'C'), r('standingPressure', P(leaked, 'MPa'), 'MPa', 'low'), r('cabinetTemperature', -62, 'C')] },
  })
  add({
    id: 'S29', title: 'ULT low-stage leak: same as S28 PLUS standing-pressure-check=low (must count once)', cls: 'ult-freezer',
    expect: { cause: 'refrigerant-leak', stage: 'low' },
    why: 'same measurement twice',
    req: { unit: ultUnit(), symptoms: ['warming-over-days'], readings: [r('ambientTemperature', amb, 'C'), r('standingPressure', P(leaked, 'MPa'), 'MPa', 'low'), r('cabinetTemperature', -62, 'C')], testResults: [t('standing-pressure-check', 'low', 'low')] },
  })
  add({
    id: 'S30', title: 'ULT: S28 + repair-phase nitrogen hold, repair-phase standing normal, verification cabinet -80', cls: 'ult-freezer',
    expect: { cause: 'refrigerant-leak', stage: 'low' },
    why: 'repair/verification data must be set aside: ranking identical to S28',
    req: {
      unit: ultUnit(), symptoms: ['warming-over-days'],
      readings: [
        r('ambientTemperature', amb, 'C'), r('standingPressure', P(leaked, 'MPa'), 'MPa', 'low'), r('cabinetTemperature', -62, 'C'),
        r('standingPressure', P(expected, 'MPa'), 'MPa', 'low', 'repair'),
        r('cabinetTemperature', -80, 'C', undefined, 'verification'), r('compressorCurrent', 4.1, 'A', 'low', 'verification'),
      ],
      testResults: [t('nitrogen-pressure-test', 'low', 'holds', 'repair'), t('leak-search', 'low', 'none-found', 'verification')],
    },
  })
  add({
    id: 'S31', title: 'ULT low-stage oil-logging (R1150), oil return pulsing, capillary warm test no change', cls: 'ult-freezer',
    expect: { cause: 'oil-logging', stage: 'low' },
    why: 'low-stage suction low, cabinet far above evaporating, high stage and HX fine, oil separator returning, warming capillary changes nothing (not ice/wax)',
    req: {
      unit: ultUnit(), symptoms: ['slow-pulldown', 'warming-over-days'],
      readings: [
        ...running({ d: 'R404A', stage: 'high', sst: -40, sh: 10, sct: 40, sc: 5, td: 95, amps: 4.8, u: 'barg' }),
        ...running({ d: 'R1150', stage: 'low', sst: -101, sh: 15, sct: -31, td: 60, amps: 3.2, u: 'barg' }),
        r('condenserAirInTemperature', 25, 'C'), r('cascadeHxTemperature', -35, 'C'), r('cabinetTemperature', -70, 'C'),
      ],
      testResults: [t('oil-return-line-check', 'low', 'pulses-warm'), t('warm-capillary-test', 'low', 'no-change')],
    },
  })
  add({
    id: 'S32', title: 'ULT low-stage restriction (drier), marked drop, readings in MPa', cls: 'ult-freezer',
    expect: { cause: 'restriction', stage: 'low' },
    why: 'low-stage suction very low, high superheat, low amps, frost spot at drier outlet',
    req: {
      unit: ultUnit(), symptoms: ['not-cooling'],
      readings: [
        ...running({ d: 'R404A', stage: 'high', sst: -42, sh: 9, sct: 39, sc: 5, td: 92, amps: 4.5, u: 'MPa' }),
        ...running({ d: 'R1150', stage: 'low', sst: -110, sh: 45, sct: -36, td: 40, amps: 2.4, u: 'MPa' }),
        r('condenserAirInTemperature', 25, 'C'), r('cascadeHxTemperature', -37, 'C'), r('cabinetTemperature', -55, 'C'),
      ],
      testResults: [t('restriction-temperature-drop', 'low', 'marked-drop')],
    },
  })
  add({
    id: 'S33', title: 'ULT healthy, noisy partial readings (barg/psig mixed)', cls: 'ult-freezer',
    expect: { cause: 'no-refrigeration-fault' },
    why: 'cabinet -79.4 vs -80, HX near design, head and suctions plausible, currents 75-80 %',
    req: {
      unit: ultUnit(),
      readings: [
        r('compressorRunning', true, 'bool', 'high'), r('compressorRunning', true, 'bool', 'low'),
        r('dischargePressure', P(bub('R404A', 40.6), 'barg'), 'barg', 'high'), r('suctionPressure', P(dew('R404A', -39.3), 'psig'), 'psig', 'high'),
        r('suctionPressure', P(dew('R1150', -91.2), 'psig'), 'psig', 'low'),
        r('compressorCurrent', 4.7, 'A', 'high'), r('compressorCurrent', 3.9, 'A', 'low'),
        r('cascadeHxTemperature', -33.8, 'C'), r('condenserAirInTemperature', 25.5, 'C'), r('cabinetTemperature', -79.4, 'C'),
      ],
    },
  })
  add({
    id: 'S34', title: 'ULT expansion-tank valve left shut after service: low-stage standing 1.6x expected', cls: 'ult-freezer',
    expect: { cause: 'expansion-tank-fault', stage: 'low' },
    why: 'same charge squeezed into the smaller volume: standing far above expected, high-pressure trips on start; overcharge is the honest runner-up',
    req: {
      unit: ultUnit(), symptoms: ['recently-serviced', 'compressor-tripping'],
      readings: [r('ambientTemperature', amb, 'C'), r('standingPressure', P(standing('R1150', amb, ULT_LOW_VOL * 0.45, ULT_LOW_CHARGE), 'barg'), 'barg', 'low'), r('cabinetTemperature', -40, 'C')],
    },
  })
}
// ----------------------------------------------------------------- test chamber / cold trap cascades
add({
  id: 'S35', title: 'Test chamber cascade R404A/R23: high-stage leak (MPa)', cls: 'test-chamber',
  expect: { cause: 'refrigerant-leak', stage: 'high' },
  why: 'high-stage suction low, superheat huge, subcooling 0, HX warm, low-stage head pushed up by warm HX',
  req: {
    unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R404A', ratedCurrentA: 9, meteringDevice: 'expansion-valve' }, { stage: 'low', refrigerant: 'R23', ratedCurrentA: 7, meteringDevice: 'expansion-valve' }], design: { cabinetC: -70, cascadeHxC: -35 } },
    symptoms: ['not-cooling'],
    readings: [
      ...running({ d: 'R404A', stage: 'high', sst: -50, sh: 30, sct: 36, sc: 0.5, td: 120, amps: 5.5, u: 'MPa' }),
      ...running({ d: 'R23', stage: 'low', sst: -74, sh: 10, sct: -18, td: 75, amps: 7.3, u: 'MPa' }),
      r('condenserAirInTemperature', 26, 'C'), r('cascadeHxTemperature', -22, 'C'), r('cabinetTemperature', -55, 'C'),
    ],
  },
})
add({
  id: 'S36', title: 'Cold trap cascade R404A/R170: high-stage condenser blocked (hot lab), psig', cls: 'cold-trap',
  expect: { cause: 'condenser-airflow', stage: 'high' },
  why: 'high head 20 K over air-in, small air rise, high amps, HX warm, low head up; both stages loaded',
  req: {
    unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R404A', ratedCurrentA: 5, meteringDevice: 'capillary' }, { stage: 'low', refrigerant: 'R170', ratedCurrentA: 4, meteringDevice: 'capillary' }], design: { cabinetC: -85, cascadeHxC: -35 } },
    symptoms: ['compressor-tripping', 'slow-pulldown'],
    readings: [
      ...running({ d: 'R404A', stage: 'high', sst: -34, sh: 9, sct: 60, sc: 4, td: 125, amps: 6.0, u: 'psig' }),
      ...running({ d: 'R170', stage: 'low', sst: -95, sh: 12, sct: -22, td: 70, amps: 4.4, u: 'psig' }),
      r('condenserAirInTemperature', 25, 'C'), r('condenserAirOutTemperature', 31, 'C'), r('cascadeHxTemperature', -26, 'C'), r('cabinetTemperature', -75, 'C'),
    ],
  },
})

// ----------------------------------------------------------------- run
const fmt = (c: { cause: string; stage?: string; probability: number }) => `${c.cause}${c.stage ? '@' + c.stage : ''} ${(c.probability * 100).toFixed(1)}%`
const results: Record<string, RankResponse> = {}
let top1 = 0, top2 = 0, top3 = 0
const json: unknown[] = []
async function main() {
  for (const s of S) {
    let res: RankResponse
    try {
      res = await rankDiagnosis(kb, s.req, { equipmentClass: s.cls })
    } catch (e) {
      console.log(`${s.id} CRASH ${(e as Error).message}`)
      json.push({ id: s.id, crash: String(e) })
      continue
    }
    results[s.id] = res
    const match = (c: { cause: string; stage?: string }) => c.cause === s.expect.cause && (s.expect.stage === undefined || c.stage === s.expect.stage)
    const rank = res.causes.findIndex(match)
    if (rank === 0) top1++
    if (rank >= 0 && rank < 2) top2++
    if (rank >= 0 && rank < 3) top3++
    const nan = res.causes.some((c) => !Number.isFinite(c.probability)) || JSON.stringify(res).includes('NaN')
    const sum = res.causes.reduce((a, c) => a + c.probability, 0)
    console.log(`\n${s.id} ${s.title}\n  expect ${s.expect.cause}${s.expect.stage ? '@' + s.expect.stage : ''} -> rank ${rank + 1} ${rank === 0 ? 'HIT' : rank === 1 ? 'top2' : 'MISS'}${nan ? ' NaN!' : ''}${Math.abs(sum - 1) > 1e-6 ? ' SUM=' + sum : ''}`)
    console.log(`  top3: ${res.causes.slice(0, 3).map(fmt).join(' | ')}`)
    const nt = res.tests[0]
    if (nt) console.log(`  next: ${nt.test}@${nt.stage} (${nt.minutes} min${nt.opensSystem ? ', OPENS' : ''}${nt.hotWork ? ', HOT' : ''}) "${nt.value}"  | then ${res.tests.slice(1, 3).map((x) => x.test + '@' + x.stage).join(', ')}`)
    else console.log('  next: none')
    if (res.warnings.length) console.log(`  warnings: ${res.warnings.join(' || ')}`)
    if (res.setAside.length) console.log(`  setAside: ${res.setAside.join(' || ')}`)
    const d = res.derived
    console.log(`  derived: ${JSON.stringify(d)}`)
    if (rank !== 0) {
      const top = res.causes[0]
      console.log(`  top evidence for ${top.cause}: ${top.evidence.slice(0, 6).map((e) => `[${e.rule} x${e.factor?.toFixed(2)}] ${e.text}`).join(' ;; ')}`)
      console.log(`  against: ${top.evidenceAgainst.slice(0, 4).map((e) => `[${e.rule} x${e.factor?.toFixed(2)}] ${e.text}`).join(' ;; ')}`)
      const exp = res.causes[rank]
      if (exp) {
        console.log(`  expected's evidence: ${exp.evidence.slice(0, 5).map((e) => `[${e.rule} x${e.factor?.toFixed(2)}]`).join(' ')}`)
        console.log(`  expected's against: ${exp.evidenceAgainst.slice(0, 5).map((e) => `[${e.rule} x${e.factor?.toFixed(2)}] ${e.text}`).join(' ;; ')}`)
      }
    }
    json.push({ id: s.id, expect: s.expect, rank: rank + 1, top3: res.causes.slice(0, 3).map(fmt), next: nt && { test: nt.test, stage: nt.stage, value: nt.value }, warnings: res.warnings, setAside: res.setAside })
  }
  console.log(`\nTOTAL ${S.length}: top1 ${top1}, top2 ${top2}, top3 ${top3}`)

  // Double counting: S28 (reading) vs S29 (reading + same-measurement test) vs test only.
  const p = (id: string) => results[id]?.causes.find((c) => c.cause === 'refrigerant-leak' && c.stage === 'low')?.probability
  const testOnly = await rankDiagnosis(kb, { unit: ultUnit(), symptoms: ['warming-over-days'], readings: [r('ambientTemperature', 22, 'C'), r('cabinetTemperature', -62, 'C')], testResults: [t('standing-pressure-check', 'low', 'low')] }, { equipmentClass: 'ult-freezer' })
  console.log(`\nDOUBLE-COUNT leak@low: reading only ${p('S28')}, reading+test ${p('S29')}, test only ${testOnly.causes.find((c) => c.cause === 'refrigerant-leak' && c.stage === 'low')?.probability}`)
  // Disagreeing pair: reading low, test as-expected
  const disagree = await rankDiagnosis(kb, { ...S.find((s) => s.id === 'S29')!.req, testResults: [t('standing-pressure-check', 'low', 'as-expected')] }, { equipmentClass: 'ult-freezer' })
  console.log(`DISAGREE pair: top ${fmt(disagree.causes[0])}; warnings: ${disagree.warnings.join(' || ')}`)
  // Repair leakage: S30 vs S28, every hypothesis.
  const a = results['S28'].causes, b = results['S30'].causes
  const maxDiff = Math.max(...a.map((c) => Math.abs(c.probability - (b.find((x) => x.cause === c.cause && x.stage === c.stage)?.probability ?? -1))))
  console.log(`REPAIR-PHASE leakage S30 vs S28 max |dp| = ${maxDiff}`)
  // Single-stage double count: standing reading + check, R134a freezer with charge data.
  const un = single('R134a', 'capillary', -20, 2.0, { chargeG: 120, volumeL: 1.6 })
  const base = { unit: un, symptoms: ['warming-over-days' as const], readings: [r('ambientTemperature', 22, 'C'), r('standingPressure', P(standing('R134a', 22, 1.6, 6), 'psig'), 'psig', 'single')] }
  const s1 = await rankDiagnosis(kb, base, { equipmentClass: 'freezer' })
  const s2 = await rankDiagnosis(kb, { ...base, testResults: [t('standing-pressure-check', 'single', 'low')] }, { equipmentClass: 'freezer' })
  const lp = (x: RankResponse) => x.causes.find((c) => c.cause === 'refrigerant-leak')?.probability
  console.log(`SINGLE-STAGE double count (R134a 6 g of 120 g, gas phase): reading only ${lp(s1)}, +check ${lp(s2)}; derived ${JSON.stringify(s1.derived)}; warnings ${s1.warnings.join(' || ')} / ${s2.warnings.join(' || ')}`)
  // Definitive-outcome sweep: how far one definitive outcome moves its cause from a bare symptom start.
  const bare: RankRequest = { unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['not-cooling'] }
  const b0 = await rankDiagnosis(kb, bare, { equipmentClass: 'cold-room' })
  console.log(`\nBARE not-cooling R404A TXV: top3 ${b0.causes.slice(0, 3).map(fmt).join(' | ')}; next ${b0.tests.slice(0, 4).map((x) => `${x.test}@${x.stage} "${x.value}"`).join(' ;; ')}`)
  const defs: [TestResult['test'], string, Cause][] = [
    ['leak-search', 'leak-found', 'refrigerant-leak'], ['nitrogen-pressure-test', 'falls', 'refrigerant-leak'], ['condenser-inspection', 'fouled-or-fan-fault', 'condenser-airflow'],
    ['sensor-verification', 'sensor-off', 'control-sensor-fault'], ['refrigerant-identification', 'mismatch-or-mixture', 'wrong-refrigerant'], ['compressor-pumping-test', 'cannot-reach', 'compressor-inefficient'],
    ['door-and-load-check', 'heat-load-problem', 'high-heat-load'], ['expansion-valve-check', 'underfeeding', 'expansion-valve-underfeeding'], ['expansion-valve-check', 'overfeeding', 'expansion-valve-overfeeding'],
    ['vacuum-decay-test', 'levels-off', 'moisture-freeze'], ['warm-capillary-test', 'flow-returns', 'moisture-freeze'], ['restriction-temperature-drop', 'marked-drop', 'restriction'],
  ]
  for (const [test, outcome, cause] of defs) {
    const x = await rankDiagnosis(kb, { ...bare, testResults: [t(test, 'single', outcome)] }, { equipmentClass: 'cold-room' })
    const pc = x.causes.find((c) => c.cause === cause)
    console.log(`  ${test}=${outcome}: ${cause} -> ${(100 * (pc?.probability ?? 0)).toFixed(1)}% (rank ${x.causes.indexOf(pc!) + 1}); top ${fmt(x.causes[0])}; next ${x.tests[0]?.test} "${x.tests[0]?.value}"`)
  }
  // Repeat test after a definitive outcome, no phase: should be taken as repair check.
  const rep = await rankDiagnosis(kb, { ...bare, testResults: [t('leak-search', 'single', 'leak-found'), t('leak-search', 'single', 'none-found')] }, { equipmentClass: 'cold-room' })
  console.log(`REPEAT leak-search found then none-found (no phase): top ${fmt(rep.causes[0])}; setAside ${rep.setAside.join(' || ')}`)

  // ----------------------------------------------------------------- EXTRA checks
  console.log('\nEXTRA')
  const show = async (label: string, req: RankRequest, cls: EquipmentClass) => {
    try {
      const x = await rankDiagnosis(kb, req, { equipmentClass: cls })
      console.log(`  ${label}: ${x.causes.slice(0, 3).map(fmt).join(' | ')} ; next ${x.tests[0]?.test}@${x.tests[0]?.stage} "${x.tests[0]?.value}"${x.warnings.length ? ' ; W: ' + x.warnings.join(' || ') : ''}${JSON.stringify(x).includes('NaN') ? ' NaN!' : ''}`)
      return x
    } catch (e) { console.log(`  ${label}: CRASH ${(e as Error).message}`) }
  }
  const S15 = S.find((s) => s.id === 'S15')!.req
  await show('S15 without tripping', { ...S15, symptoms: ['recently-serviced'] }, 'freezer')
  await show('S15 with label-mismatch', { ...S15, symptoms: ['recently-serviced', 'compressor-tripping', 'refrigerant-label-mismatch'] }, 'freezer')
  const S16 = S.find((s) => s.id === 'S16')!.req
  await show('S16 at 800 kPa, no identifier', { ...S16, readings: [r('ambientTemperature', 25, 'C'), r('standingPressure', 800, 'kPa', 'single'), r('cabinetTemperature', -11, 'C')], testResults: [] }, 'cold-room')
  const S18 = S.find((s) => s.id === 'S18')!.req
  await show('S18 with not-cooling instead of warming', { ...S18, symptoms: ['not-cooling'] }, 'freezer')
  await show('S18 no symptom', { ...S18, symptoms: [] }, 'freezer')
  const x18 = results['S18']
  for (const c of x18.causes.slice(0, 5)) console.log(`    S18 ${fmt(c)} for: ${c.evidence.map((e) => e.rule + ' x' + e.factor?.toFixed(2)).join(', ')} against: ${c.evidenceAgainst.map((e) => e.rule + ' x' + e.factor?.toFixed(2)).join(', ')}`)
  const x20 = results['S20']
  for (const c of x20.causes.slice(0, 4)) console.log(`    S20 ${fmt(c)} for: ${c.evidence.map((e) => e.rule + ' x' + e.factor?.toFixed(2)).join(', ')} against: ${c.evidenceAgainst.map((e) => e.rule + ' x' + e.factor?.toFixed(2)).join(', ')}`)
  const x31 = results['S31']
  for (const c of x31.causes.slice(0, 3)) console.log(`    S31 ${fmt(c)} for: ${c.evidence.map((e) => e.rule + ' x' + e.factor?.toFixed(2)).join(', ')} against: ${c.evidenceAgainst.map((e) => e.rule + ' x' + e.factor?.toFixed(2)).join(', ')}`)
  // Temperatures in F / K must give the same answer as in C.
  const S01 = S.find((s) => s.id === 'S01')!.req
  const toF = (rd: Reading): Reading => (rd.unit === 'C' ? { ...rd, value: fix((rd.value as number) * 9 / 5 + 32), unit: 'F' } : rd)
  const f1 = await rankDiagnosis(kb, { ...S01, readings: S01.readings!.map(toF) }, { equipmentClass: 'cold-room' })
  console.log(`  S01 in F: leak ${fmt(f1.causes[0])} vs C ${fmt(results['S01'].causes[0])}`)
  // R744 running transcritical (discharge above critical) and subcritical.
  const r744 = { kind: 'single-stage' as const, stages: [{ stage: 'single' as const, refrigerant: 'R744', meteringDevice: 'expansion-valve' as const, ratedCurrentA: 6 }], design: { cabinetC: -2 } }
  await show('R744 transcritical running healthy (9.0 MPa discharge, 30 C air)', { unit: r744, readings: [...running({ d: 'R744', stage: 'single', sst: -12, sh: 8, u: 'MPa' }), r('dischargePressure', 9.0, 'MPa', 'single'), r('dischargeTemperature', 105, 'C', 'single'), r('liquidLineTemperature', 33, 'C', 'single'), r('compressorCurrent', 5, 'A', 'single'), r('condenserAirInTemperature', 30, 'C'), r('cabinetTemperature', 0, 'C')] }, 'cold-room')
  await show('R744 subcritical running healthy (10 C air)', { unit: r744, readings: [...running({ d: 'R744', stage: 'single', sst: -12, sh: 8, sct: 25, sc: 3, td: 80, amps: 5, u: 'barg' }), r('condenserAirInTemperature', 10, 'C'), r('cabinetTemperature', -1, 'C')] }, 'cold-room')
  // Altitude ignored: same psig readings of S12 without site altitude.
  const S12 = S.find((s) => s.id === 'S12')!.req
  await show('S12 readings without the altitude', { ...S12, site: undefined }, 'freezer')
  // Warm capillary / vacuum decay on a TXV stage: moisture-freeze on a TXV cold room.
  await show('R404A TXV moisture (ice at valve orifice), warm test flow-returns + vacuum levels-off', { unit: single('R404A', 'expansion-valve', -20, 8), symptoms: ['intermittent-cooling', 'recently-serviced'], readings: [...running({ d: 'R404A', stage: 'single', sst: -42, sh: 26, sct: 42, sc: 9, td: 115, amps: 5, u: 'psig' }), r('condenserAirInTemperature', 28, 'C'), r('cabinetTemperature', -10, 'C')], testResults: [t('warm-capillary-test', 'single', 'flow-returns')] }, 'cold-room')
  // Definitive sweep: top-3 after each definitive outcome, from the bare start.
  for (const [test, outcome] of [['sensor-verification', 'sensor-off'], ['refrigerant-identification', 'mismatch-or-mixture'], ['compressor-pumping-test', 'cannot-reach'], ['door-and-load-check', 'heat-load-problem']] as const)
    await show(`bare + ${test}=${outcome}`, { ...bare, testResults: [t(test, 'single', outcome)] }, 'cold-room')
  // Test proposals: odd applicability and ordering.
  for (const s of S) {
    const res = results[s.id]
    if (!res) continue
    const unit = s.req.unit
    const odd: string[] = []
    res.tests.forEach((x, i) => {
      const cfg = unit.stages.find((st) => st.stage === x.stage)
      if (x.test === 'warm-capillary-test' && cfg?.meteringDevice === 'expansion-valve') odd.push(`#${i + 1} warm-capillary on valve stage`)
      if (x.test === 'expansion-valve-check' && cfg?.meteringDevice === 'capillary') odd.push(`#${i + 1} valve check on capillary stage`)
      if (x.test === 'oil-return-line-check' && unit.kind === 'single-stage') odd.push(`#${i + 1} oil-return-line-check on single-stage`)
      if (x.opensSystem && res.tests.slice(i + 1).some((y) => !y.opensSystem)) odd.push(`#${i + 1} ${x.test} opens system ahead of a non-opening test`)
    })
    const list = res.tests.map((x) => `${x.test}${x.opensSystem ? '*' : ''}`).join(', ')
    console.log(`  ${s.id} tests: ${list}${odd.length ? '  ODD: ' + odd.join('; ') : ''}`)
  }
  // Collect all next-test value texts.
  const texts = new Set<string>()
  for (const res of Object.values(results)) for (const x of res.tests) texts.add(`${x.test}: ${x.value}`)
  console.log(`\nALL NEXT-TEST TEXTS (${texts.size}):\n  ` + [...texts].join('\n  '))
  const { writeFileSync } = await import('node:fs')
  writeFileSync(process.cwd() + '/.probe2-tmp/results.json', JSON.stringify(json, null, 1))
}
main()
