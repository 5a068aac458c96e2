/**
 * Scenario suite, held-out part: written with the tuning part and never used to adjust the knowledge
 * base. Its figures say how the model does on cases it was not tuned on. Different units, magnitudes,
 * presentations (units, altitude, noise) and symptom mixes from the tuning part.
 */
import { standingPressureFromCharge } from '#shared/utils/properties'
import type { ScenarioSpec } from './builder'
import { healthy, stopped, withState } from './baselines'
import { CP, KIM, RB97, RB97_CASCADE } from './sources'

const txv = (stage: 'high' | 'low' | 'single'): ScenarioSpec['unitPatch'] =>
  (unit) => ({ ...unit, stages: unit.stages.map((s) => (s.stage === stage ? { ...s, meteringDevice: 'expansion-valve' as const } : s)) })

const earlier = (id: string, title: string, source: string, cause: ScenarioSpec['expected']['cause'], c: { sst: number; sct: number; superheat: number; subcooling: number; currentPct: number; airOut: number; cabinet: number; dischargeSuperheat?: number; evaporator?: number }): ScenarioSpec => ({
  id,
  title,
  source,
  unit: 'freezerR290',
  expected: { cause, stage: 'single' },
  state: withState(healthy('freezerR290', 25), {
    cabinet: c.cabinet,
    airOut: c.airOut,
    single: { sst: c.sst, sct: c.sct, superheat: c.superheat, subcooling: c.subcooling, currentPct: c.currentPct, dischargeSuperheat: c.dischargeSuperheat ?? 45, ...(c.evaporator !== undefined ? { evaporator: c.evaporator } : {}) },
  }),
})

const EARLIER_CHECKS: ScenarioSpec[] = [
  earlier('H34', 'Freezer leak (earlier check)', RB97('refrigerant leak'), 'refrigerant-leak', { sst: -38, sct: 33, superheat: 22, subcooling: 0.5, currentPct: 70, airOut: 31, cabinet: -8 }),
  earlier('H35', 'Freezer overcharge (earlier check)', RB97('overcharge'), 'overcharge', { sst: -26, sct: 50, superheat: 1.5, subcooling: 12, currentPct: 118, airOut: 34, cabinet: -14 }),
  earlier('H36', 'Freezer restriction (earlier check)', RB97('liquid-line restriction'), 'restriction', { sst: -40, sct: 36, superheat: 18, subcooling: 12, currentPct: 65, airOut: 31, cabinet: -8 }),
  earlier('H37', 'Freezer condenser airflow (earlier check)', RB97('condenser fouling'), 'condenser-airflow', { sst: -28, sct: 52, superheat: 7, subcooling: 6, currentPct: 120, airOut: 42, cabinet: -12 }),
  earlier('H38', 'Freezer evaporator airflow (earlier check)', RB97('evaporator fouling'), 'evaporator-airflow', { sst: -40, sct: 37, superheat: 1, subcooling: 5, currentPct: 85, airOut: 33, cabinet: -5, evaporator: -39 }),
  earlier('H39', 'Freezer compressor valves leaking (earlier check)', RB97('compressor valve leakage'), 'compressor-inefficient', { sst: -22, sct: 32, superheat: 9, subcooling: 4, currentPct: 50, airOut: 30, cabinet: -6, dischargeSuperheat: 85 }),
  earlier('H40', 'Freezer with non-condensables (earlier check)', CP('head high with condensing far above the air while the air-side rise is normal'), 'non-condensables', { sst: -29, sct: 50, superheat: 8, subcooling: 12, currentPct: 112, airOut: 33, cabinet: -14 }),
  {
    id: 'H41', title: 'Cascade, low standing at 40 % (earlier check)', source: CP('a gas-charged low stage stands in proportion to its charge'), unit: 'ultR290R1150', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['not-cooling'],
    state: { ambient: 21, cabinet: -45, cascadeHx: -36, setpoint: -80, high: { running: true }, low: { running: true, standingFraction: 0.4 } },
  },
  {
    id: 'H42', title: 'R134a unit standing at the propane pressure (earlier check)', source: CP('a standing pressure on another refrigerant’s saturation curve identifies the charge'), unit: 'fridgeR134a', expected: { cause: 'wrong-refrigerant', stage: 'single' },
    symptoms: ['not-cooling'],
    state: { ambient: 22, single: { actual: 'R290', standingFraction: 1 } },
  },
]

export const HELD_OUT: ScenarioSpec[] = [
  {
    id: 'H01', title: 'Vaccine fridge slowly losing charge, psig and °F', source: RB97('refrigerant leak'), unit: 'fridgeR134a', expected: { cause: 'refrigerant-leak', stage: 'single' },
    symptoms: ['warming-over-days'], show: { pressure: 'psig', temperature: 'F' },
    state: withState(healthy('fridgeR134a', 23), { cabinet: 11, airOut: 28, single: { sst: -12, sct: 34, superheat: 15, subcooling: 1, currentPct: 70 } }),
  },
  {
    id: 'H02', title: 'Cold room overcharged after a top-up, barg', source: KIM('overcharge'), unit: 'coldRoomR404a', expected: { cause: 'overcharge', stage: 'single' },
    symptoms: ['recently-serviced'], show: { pressure: 'barg' },
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 4, airOut: 34, single: { sst: -6, sct: 50, superheat: 2, subcooling: 14, currentPct: 112 } }),
  },
  {
    id: 'H03', title: 'Chiller tripping with a blocked condenser, MPa', source: RB97('condenser fouling'), unit: 'chillerR134a', expected: { cause: 'condenser-airflow', stage: 'single' },
    symptoms: ['compressor-tripping', 'slow-pulldown'], show: { pressure: 'MPa' },
    state: withState(healthy('chillerR134a', 28), { cabinet: 14, airOut: 47, single: { sst: 2, sct: 58, superheat: 6, subcooling: 4, currentPct: 120 } }),
  },
  {
    id: 'H04', title: 'Chest freezer with a partly blocked drier, at 1500 m, psig', source: RB97('liquid-line restriction'), unit: 'chestR290', expected: { cause: 'restriction', stage: 'single' },
    symptoms: ['frost-on-capillary'], show: { pressure: 'psig', altitudeM: 1500 },
    state: withState(healthy('chestR290'), { cabinet: -12, airOut: 27, single: { sst: -45, sct: 33, superheat: 15, subcooling: 12, currentPct: 72 } }),
  },
  {
    id: 'H05', title: 'Freezer with a heavily iced coil', source: RB97('evaporator fouling'), unit: 'freezerR404a', expected: { cause: 'evaporator-airflow', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('freezerR404a', 25), { cabinet: -20, airOut: 31, single: { sst: -50, sct: 37, superheat: 2, subcooling: 5, currentPct: 82, evaporator: -49 } }),
  },
  {
    id: 'H06', title: 'Freezer compressor worn, noisy, kPag', source: RB97('compressor valve leakage'), unit: 'freezerR290', expected: { cause: 'compressor-inefficient', stage: 'single' },
    symptoms: ['noisy-compressor'], show: { pressure: 'kPag' },
    state: withState(healthy('freezerR290', 25), { cabinet: -10, airOut: 29, single: { sst: -22, sct: 33, superheat: 9, subcooling: 3, dischargeSuperheat: 90, currentPct: 52 } }),
  },
  {
    id: 'H07', title: 'Chest freezer with nitrogen left in, bar', source: KIM('non-condensable gas'), unit: 'chestR290', expected: { cause: 'non-condensables', stage: 'single' },
    symptoms: ['recently-serviced'], show: { pressure: 'bar' },
    state: withState(healthy('chestR290'), { cabinet: -19, single: { sst: -33, sct: 50, superheat: 6, subcooling: 12, currentPct: 110 } }),
  },
  {
    id: 'H08', title: 'Chiller humming, compressor at 0 A', source: CP('a compressor called to run but drawing no current is not running, whatever is heard'), unit: 'chillerR134a', expected: { cause: 'compressor-electrical', stage: 'single' },
    symptoms: ['compressor-tripping'],
    state: { ambient: 27, cabinet: 18, single: { running: true, currentPct: 0 } },
  },
  {
    id: 'H09', title: 'Cold room after a long delivery with the door open', source: CP('a high load raises suction and superheat and keeps the compressor running'), unit: 'coldRoomR404a', expected: { cause: 'high-heat-load', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 12, runtime: 600, airOut: 35, single: { sst: -2, sct: 43, superheat: 12, currentPct: 100 } }),
  },
  {
    id: 'H10', title: 'Freezer healthy, noisy gauges in psig', source: CP('healthy readings at the design point'), unit: 'freezerR404a', expected: { cause: 'no-refrigeration-fault' },
    show: { pressure: 'psig', noiseSeed: 10 },
    state: withState(healthy('freezerR404a', 25), { cabinet: -29 }),
  },
  {
    id: 'H11', title: 'Chest freezer at design, display shows +15 °C', source: CP('a stage at its design evaporating temperature cannot carry a cabinet tens of kelvin warm'), unit: 'chestR290', expected: { cause: 'control-sensor-fault', stage: 'single' },
    symptoms: ['not-cooling'],
    state: withState(healthy('chestR290'), { cabinet: 15, single: { evaporator: -34 } }),
  },
  {
    id: 'H12', title: 'Freezer holding R22 instead of R404A', source: CP('a standing pressure on another refrigerant’s saturation curve identifies the charge'), unit: 'freezerR404a', expected: { cause: 'wrong-refrigerant', stage: 'single' },
    symptoms: ['refrigerant-label-mismatch'],
    state: { ambient: 24, cabinet: -15, single: { actual: 'R22', standingFraction: 1, running: false } },
  },
  {
    id: 'H13', title: 'Cold room topped up with R134a on an R404A charge', source: CP('a mixed charge stands off the nameplate curve and fits no single refrigerant (pressure by Raoult’s law, an approximation)'), unit: 'coldRoomR404a', expected: { cause: 'wrong-refrigerant', stage: 'single' },
    symptoms: ['recently-serviced', 'slow-pulldown'],
    state: { ambient: 22, cabinet: 8, single: { standingFraction: 1, mixedWith: { designation: 'R134a', share: 0.3 }, running: false } },
  },
  {
    id: 'H14', title: 'ULT freezer at 1450 m, ethane low stage short, psig', source: CP('a gas-charged low stage stands in proportion to its charge, and runs starved'), unit: 'ultR290R170', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['not-cooling'], show: { pressure: 'psig', altitudeM: 1450 },
    state: withState(healthy('ultR290R170', 20), { cabinet: -60, cascadeHx: -37, low: { sst: -104, sct: -33, superheat: 60, subcooling: 0.5, currentPct: 70, standingFraction: 0.55 } }),
  },
  {
    id: 'H15', title: 'R508B freezer warming over days, standing check only', source: CP('a gas-charged low stage stands in proportion to its charge (isochore from the equation of state)'), unit: 'ultR507aR508b', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['warming-over-days'],
    state: { ambient: 23, cabinet: -50, cascadeHx: -31, high: { running: true }, low: { running: true, standingFraction: 0.6 } },
  },
  {
    id: 'H16', title: 'Test chamber tripping in a hot lab, high-stage condenser', source: RB97_CASCADE('condenser fouling'), unit: 'chamberR404aR23', expected: { cause: 'condenser-airflow', stage: 'high' },
    symptoms: ['compressor-tripping'],
    state: withState(healthy('chamberR404aR23', 30), { cabinet: -55, cascadeHx: -18, airOut: 50, high: { sst: -26, sct: 60, subcooling: 6, currentPct: 120 }, low: { sst: -69, sct: -12 } }),
  },
  {
    id: 'H17', title: 'Cold trap high stage short of charge', source: RB97_CASCADE('refrigerant leak'), unit: 'trapR404aR1150', expected: { cause: 'refrigerant-leak', stage: 'high' },
    symptoms: ['not-cooling'],
    state: withState(healthy('trapR404aR1150', 22), { cabinet: -75, cascadeHx: -26, high: { sst: -52, sct: 30, superheat: 20, subcooling: 0.5, currentPct: 62 }, low: { sst: -89, sct: -20, currentPct: 100 } }),
  },
  {
    id: 'H18', title: 'R23 low stage with air in it after a repair', source: KIM('non-condensable gas'), unit: 'ultR134aR23', expected: { cause: 'non-condensables', stage: 'low' },
    symptoms: ['recently-serviced'],
    state: withState(healthy('ultR134aR23', 22), {
      cabinet: -68,
      low: { sct: -14, subcooling: 13, currentPct: 105, standingKpa: 1.3 * standingPressureFromCharge({ designation: 'R23', ambientC: 22, volumeL: 10, chargeG: 250 }).pressureKpa },
    }),
  },
  {
    id: 'H19', title: 'ULT freezer, frost on the low-stage capillary, few readings', source: CP('a blocked low stage: suction low, standing pressure as expected'), unit: 'ultR290R1150', expected: { cause: 'restriction', stage: 'low' },
    symptoms: ['frost-on-capillary'],
    state: { ambient: 21, cabinet: -50, cascadeHx: -35, low: { sst: -104, standingFraction: 1 } },
  },
  {
    id: 'H20', title: 'CO2 chamber, high-stage compressor will not start', source: CP('a compressor called to run but stopped at 0 A points to its electrics; the low stage then cannot condense'), unit: 'chamberR134aR744', expected: { cause: 'compressor-electrical', stage: 'high' },
    symptoms: ['compressor-not-starting', 'not-cooling'],
    state: withState(healthy('chamberR134aR744', 22), { cabinet: -20, cascadeHx: 8, airOut: 22, high: stopped, low: { sst: -34, sct: 15, currentPct: 115 } }),
  },
  {
    id: 'H21', title: 'Cold trap low stage tripping at start, standing high', source: CP('an isolated expansion tank leaves the low-stage gas in a smaller volume'), unit: 'trapR507aR1150', expected: { cause: 'expansion-tank-fault', stage: 'low' },
    symptoms: ['compressor-tripping'],
    state: withState(healthy('trapR507aR1150', 22), {
      cabinet: -103,
      low: { standingKpa: standingPressureFromCharge({ designation: 'R1150', ambientC: 22, volumeL: 4, chargeG: 160 }).pressureKpa },
    }),
  },
  {
    id: 'H22', title: 'ULT freezer healthy, MPa and °F', source: CP('healthy readings at the design point'), unit: 'ultR404aR170', expected: { cause: 'no-refrigeration-fault' },
    show: { pressure: 'MPa', temperature: 'F' },
    state: withState(healthy('ultR404aR170', 22), { cabinet: -80, low: { standingFraction: 1 } }),
  },
  {
    id: 'H23', title: 'R508B freezer, evaporator probe reading below saturation', source: CP('no coil runs colder than its refrigerant boils; a probe that says so is faulty'), unit: 'ultR507aR508b', expected: { cause: 'control-sensor-fault', stage: 'low' },
    symptoms: ['intermittent-cooling'],
    state: withState(healthy('ultR507aR508b', 22), { cabinet: -79, low: { evaporator: -112 } }),
  },
  {
    id: 'H24', title: 'Chiller expansion valve starving the evaporator', source: KIM('expansion-device restriction'), unit: 'chillerR134a', expected: { cause: 'expansion-valve-underfeeding', stage: 'single' },
    symptoms: ['not-cooling'], unitPatch: txv('single'),
    state: withState(healthy('chillerR134a', 27), { cabinet: 16, airOut: 33, single: { sst: -8, sct: 38, superheat: 16, subcooling: 8, currentPct: 75 } }),
  },
  {
    id: 'H25', title: 'Fridge with ice at the capillary after a compressor change', source: CP('moisture freezes at the capillary outlet: restriction readings while blocked, cooling that comes and goes'), unit: 'fridgeR134a', expected: { cause: 'moisture-freeze', stage: 'single' },
    symptoms: ['intermittent-cooling', 'recently-serviced'],
    state: withState(healthy('fridgeR134a', 23), { cabinet: 10, single: { sst: -14, sct: 35, superheat: 15, subcooling: 8, currentPct: 75 } }),
  },
  {
    id: 'H26', title: 'Freezer overcharged, tripping and knocking, noisy gauges', source: KIM('overcharge'), unit: 'freezerR290', expected: { cause: 'overcharge', stage: 'single' },
    symptoms: ['compressor-tripping', 'noisy-compressor'], show: { noiseSeed: 26 },
    state: withState(healthy('freezerR290', 25), { cabinet: -15, airOut: 34, single: { sst: -28, sct: 50, superheat: 1, subcooling: 14, currentPct: 115 } }),
  },
  {
    id: 'H27', title: 'ULT freezer, high-stage drier blocked', source: RB97_CASCADE('liquid-line restriction'), unit: 'ultR404aR170', expected: { cause: 'restriction', stage: 'high' },
    symptoms: ['frost-on-capillary'],
    state: withState(healthy('ultR404aR170', 22), { cabinet: -58, cascadeHx: -20, high: { sst: -48, sct: 35, superheat: 18, subcooling: 12, currentPct: 70 }, low: { sst: -72, sct: -16 } }),
  },
  {
    id: 'H28', title: 'Chest freezer healthy at 1800 m, psig', source: CP('healthy readings at the design point'), unit: 'chestR290', expected: { cause: 'no-refrigeration-fault' },
    show: { pressure: 'psig', altitudeM: 1800 },
    state: withState(healthy('chestR290'), { cabinet: -24.5 }),
  },
  {
    id: 'H29', title: 'Cold room leak, suction side only, psig', source: RB97('refrigerant leak'), unit: 'coldRoomR404a', expected: { cause: 'refrigerant-leak', stage: 'single' },
    symptoms: ['not-cooling'], show: { pressure: 'psig' },
    state: { cabinet: 9, single: { sst: -16, superheat: 16 } },
  },
  {
    id: 'H30', title: 'ULT freezer, low stage will not start', source: CP('a compressor called to run but stopped at 0 A points to its electrics'), unit: 'ultR290R170', expected: { cause: 'compressor-electrical', stage: 'low' },
    symptoms: ['compressor-not-starting'],
    state: withState(healthy('ultR290R170', 22), { cabinet: -55, cascadeHx: -41, low: stopped, high: { sst: -45, currentPct: 70 } }),
  },
  {
    id: 'H31', title: 'R23 stage refilled with R508B', source: CP('an evaporator colder than the nameplate refrigerant can boil at that pressure, on another refrigerant’s curve'), unit: 'ultR134aR23', expected: { cause: 'wrong-refrigerant', stage: 'low' },
    symptoms: ['recently-serviced'],
    state: withState(healthy('ultR134aR23', 22), { cabinet: -70, low: { actual: 'R508B', sst: -92, sct: -25, evaporator: -91 } }),
  },
  {
    id: 'H32', title: 'Cold room valve overfeeding, compressor knocking', source: CP('an overfeeding valve drives superheat to zero without raising head or subcooling'), unit: 'coldRoomR404a', expected: { cause: 'expansion-valve-overfeeding', stage: 'single' },
    symptoms: ['noisy-compressor'], unitPatch: txv('single'),
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 4, single: { sst: -5, sct: 39, superheat: 0.5, subcooling: 3, dischargeSuperheat: 15, currentPct: 92 } }),
  },
  {
    id: 'H33', title: 'R508B freezer reported warm, found healthy', source: CP('healthy readings at the design point'), unit: 'ultR507aR508b', expected: { cause: 'no-refrigeration-fault' },
    symptoms: ['not-cooling'],
    state: withState(healthy('ultR507aR508b', 23), { cabinet: -79.5, low: { standingFraction: 1 } }),
  },

  // The project's earlier trade checks (written before this model), kept here as part of the held-out part.
  ...EARLIER_CHECKS,
]
