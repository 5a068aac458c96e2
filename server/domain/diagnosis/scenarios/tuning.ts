/**
 * Scenario suite, tuning part: the knowledge base may be adjusted while watching these.
 * Each scenario names the source of its fault signature; the numbers are the trade's physics at a
 * moderate severity, turned into readings by the builder.
 */
import { standingPressureFromCharge } from '#shared/utils/properties'
import type { ScenarioSpec } from './builder'
import { healthy, stopped, withState } from './baselines'
import { CP, KIM, RB97, RB97_CASCADE } from './sources'

const ev = (u: ScenarioSpec['unitPatch']) => u
const txv = (stage: 'high' | 'low' | 'single') =>
  ev((unit) => ({ ...unit, stages: unit.stages.map((s) => (s.stage === stage ? { ...s, meteringDevice: 'expansion-valve' as const } : s)) }))

export const TUNING: ScenarioSpec[] = [
  // ------------------------------------------------------------ single-stage
  {
    id: 'T01', title: 'Chest freezer losing charge', source: RB97('refrigerant leak'), unit: 'chestR290', expected: { cause: 'refrigerant-leak', stage: 'single' },
    symptoms: ['not-cooling'],
    state: withState(healthy('chestR290'), { cabinet: -12, airOut: 27, single: { sst: -42, sct: 32, superheat: 20, subcooling: 0.5, dischargeSuperheat: 70, currentPct: 68 } }),
  },
  {
    id: 'T02', title: 'Chest freezer topped up without weighing', source: KIM('overcharge'), unit: 'chestR290', expected: { cause: 'overcharge', stage: 'single' },
    symptoms: ['slow-pulldown', 'recently-serviced'],
    state: withState(healthy('chestR290'), { cabinet: -19, airOut: 31, single: { sst: -33, sct: 46, superheat: 1.5, subcooling: 13, dischargeSuperheat: 28, currentPct: 112 } }),
  },
  {
    id: 'T03', title: 'Freezer with a blocked drier', source: RB97('liquid-line restriction'), unit: 'freezerR290', expected: { cause: 'restriction', stage: 'single' },
    symptoms: ['not-cooling', 'frost-on-capillary'],
    state: withState(healthy('freezerR290', 25), { cabinet: -9, airOut: 30, single: { sst: -41, sct: 37, superheat: 17, subcooling: 13, dischargeSuperheat: 60, currentPct: 70 } }),
  },
  {
    id: 'T04', title: 'Cold room with a fouled condenser', source: RB97('condenser fouling'), unit: 'coldRoomR404a', expected: { cause: 'condenser-airflow', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('coldRoomR404a', 27), { cabinet: 7, airOut: 45, single: { sst: -6, sct: 55, superheat: 7, subcooling: 5, currentPct: 118 } }),
  },
  {
    id: 'T05', title: 'Cold room with an iced evaporator', source: RB97('evaporator fouling'), unit: 'coldRoomR404a', expected: { cause: 'evaporator-airflow', stage: 'single' },
    symptoms: ['not-cooling'],
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 9, airOut: 32, single: { sst: -18, sct: 36, superheat: 2, subcooling: 6, currentPct: 90, evaporator: -17 } }),
  },
  {
    id: 'T06', title: 'Freezer compressor with leaking valves', source: RB97('compressor valve leakage'), unit: 'freezerR404a', expected: { cause: 'compressor-inefficient', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('freezerR404a', 25), { cabinet: -18, airOut: 30, single: { sst: -30, sct: 33, superheat: 10, subcooling: 3, dischargeSuperheat: 85, currentPct: 55 } }),
  },
  {
    id: 'T07', title: 'Chest freezer with air left in after a repair', source: KIM('non-condensable gas'), unit: 'chestR290', expected: { cause: 'non-condensables', stage: 'single' },
    symptoms: ['slow-pulldown', 'recently-serviced'],
    state: withState(healthy('chestR290'), { cabinet: -18, airOut: 30, single: { sst: -34, sct: 52, superheat: 7, subcooling: 11, currentPct: 112 } }),
  },
  {
    id: 'T08', title: 'Chest freezer compressor off on its overload', source: CP('a compressor called to run but stopped at 0 A points to its electrics'), unit: 'chestR290', expected: { cause: 'compressor-electrical', stage: 'single' },
    symptoms: ['not-cooling', 'compressor-tripping'],
    state: withState(healthy('chestR290'), { cabinet: 2, airOut: 22, single: stopped }),
  },
  {
    id: 'T09', title: 'Fridge loaded with warm stock', source: CP('a high load raises suction and superheat and keeps the compressor running'), unit: 'fridgeR134a', expected: { cause: 'high-heat-load', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('fridgeR134a', 23), { cabinet: 12, runtime: 300, airOut: 33, single: { sst: 1, sct: 41, superheat: 14, subcooling: 4, currentPct: 100 } }),
  },
  {
    id: 'T10', title: 'Cold room, nothing wrong at the visit', source: CP('healthy readings at the design point'), unit: 'coldRoomR404a', expected: { cause: 'no-refrigeration-fault' },
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 2.5 }),
  },
  {
    id: 'T11', title: 'Freezer running at design with its cabinet probe reading +18 °C', source: CP('a stage at its design evaporating temperature cannot carry a cabinet tens of kelvin warm'), unit: 'freezerR290', expected: { cause: 'control-sensor-fault', stage: 'single' },
    symptoms: ['not-cooling'],
    state: withState(healthy('freezerR290', 25), { cabinet: 18, single: { currentPct: 88 } }),
  },
  {
    id: 'T12', title: 'Fridge filled with propane instead of R134a', source: CP('a standing pressure on another refrigerant’s saturation curve identifies the charge'), unit: 'fridgeR134a', expected: { cause: 'wrong-refrigerant', stage: 'single' },
    symptoms: ['recently-serviced', 'slow-pulldown'],
    state: { ambient: 22, cabinet: 12, single: { actual: 'R290', standingFraction: 1, running: false } },
  },
  {
    id: 'T13', title: 'Cold room expansion valve with a lost bulb charge', source: KIM('expansion-device restriction'), unit: 'coldRoomR404a', expected: { cause: 'expansion-valve-underfeeding', stage: 'single' },
    symptoms: ['not-cooling'], unitPatch: txv('single'),
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 8, airOut: 31, single: { sst: -16, sct: 37, superheat: 18, subcooling: 7, currentPct: 78 } }),
  },
  {
    id: 'T14', title: 'Chiller valve bulb loose, liquid reaching the compressor', source: CP('an overfeeding valve drives superheat to zero without raising head or subcooling'), unit: 'chillerR134a', expected: { cause: 'expansion-valve-overfeeding', stage: 'single' },
    symptoms: ['noisy-compressor'], unitPatch: txv('single'),
    state: withState(healthy('chillerR134a', 27), { cabinet: 11, airOut: 36, single: { sst: 2, sct: 41, superheat: 0.8, subcooling: 3, dischargeSuperheat: 15, currentPct: 95 } }),
  },
  {
    id: 'T15', title: 'Freezer with ice forming at the capillary after a repair', source: CP('moisture freezes at the capillary outlet: restriction readings while blocked, cooling that comes and goes'), unit: 'freezerR290', expected: { cause: 'moisture-freeze', stage: 'single' },
    symptoms: ['intermittent-cooling', 'recently-serviced'],
    state: withState(healthy('freezerR290', 25), { cabinet: -10, single: { sst: -40, sct: 36, superheat: 16, subcooling: 9, currentPct: 72 } }),
  },
  {
    id: 'T16', title: 'Chest freezer leak, suction side only, psig and °F', source: RB97('refrigerant leak'), unit: 'chestR290', expected: { cause: 'refrigerant-leak', stage: 'single' },
    symptoms: ['not-cooling', 'oil-at-fitting'], show: { pressure: 'psig', temperature: 'F' },
    state: { cabinet: -11, single: { sst: -41, superheat: 19 } },
  },
  // ------------------------------------------------------------ cascades
  {
    id: 'T20', title: 'ULT freezer, ethane low stage standing at 45 % of its charge', source: CP('a gas-charged low stage stands in proportion to its charge (isochore from the equation of state)'), unit: 'ultR404aR170', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['not-cooling'],
    state: { ambient: 21, cabinet: -45, cascadeHx: -33, high: { running: true }, low: { running: true, standingFraction: 0.45 } },
  },
  {
    id: 'T21', title: 'ULT freezer, ethane low stage running short of charge', source: CP('a starved low stage: suction low, superheat high, head and current low, cascade heat exchanger cold'), unit: 'ultR404aR170', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['warming-over-days'],
    state: withState(healthy('ultR404aR170', 22), { cabinet: -50, cascadeHx: -34, low: { sst: -100, sct: -31, superheat: 60, subcooling: 0.5, currentPct: 65 }, high: { sst: -38 } }),
  },
  {
    id: 'T22', title: 'ULT freezer, propane high stage short of charge', source: RB97_CASCADE('refrigerant leak'), unit: 'ultR290R170', expected: { cause: 'refrigerant-leak', stage: 'high' },
    symptoms: ['not-cooling'],
    state: withState(healthy('ultR290R170', 22), { cabinet: -55, cascadeHx: -18, high: { sst: -50, sct: 30, superheat: 22, subcooling: 0.5, currentPct: 65 }, low: { sst: -69, sct: -12, currentPct: 110 } }),
  },
  {
    id: 'T23', title: 'ULT freezer in a hot corner, high-stage condenser choked', source: RB97_CASCADE('condenser fouling'), unit: 'ultR507aR508b', expected: { cause: 'condenser-airflow', stage: 'high' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('ultR507aR508b', 24), { cabinet: -62, cascadeHx: -20, airOut: 42, high: { sst: -30, sct: 58, subcooling: 5, currentPct: 118 }, low: { sst: -76, sct: -14, currentPct: 100 } }),
  },
  {
    id: 'T24', title: 'ULT freezer, R23 low-stage capillary partly blocked', source: CP('a blocked low stage: suction low, subcooling high, standing pressure as expected'), unit: 'ultR134aR23', expected: { cause: 'restriction', stage: 'low' },
    symptoms: ['not-cooling', 'frost-on-capillary'],
    state: withState(healthy('ultR134aR23', 22), { cabinet: -52, cascadeHx: -33, low: { sst: -103, sct: -28, superheat: 70, subcooling: 10, currentPct: 70, standingFraction: 0.98 } }),
  },
  {
    id: 'T25', title: 'Cold trap cooling on and off after a recharge', source: CP('moisture freezing at the low-stage capillary'), unit: 'trapR404aR1150', expected: { cause: 'moisture-freeze', stage: 'low' },
    symptoms: ['intermittent-cooling', 'recently-serviced'],
    state: withState(healthy('trapR404aR1150', 22), { cabinet: -70, low: { sst: -122, sct: -36, subcooling: 9, currentPct: 72, standingFraction: 1 } }),
  },
  {
    id: 'T26', title: 'ULT freezer, noisy low-stage compressor and cooling that comes and goes', source: CP('oil return blocked: the compressor runs short of oil and oil waxes in the capillary'), unit: 'ultR290R1150', expected: { cause: 'oil-return-blocked', stage: 'low' },
    symptoms: ['noisy-compressor', 'intermittent-cooling'],
    state: withState(healthy('ultR290R1150', 22), { cabinet: -60, cascadeHx: -36, low: { sst: -101, sct: -37, currentPct: 75, standingFraction: 1 } }),
  },
  {
    id: 'T27', title: 'Test chamber pulling down after a warm load', source: CP('a high load raises low-stage suction and keeps the cabinet warm while the circuits are healthy'), unit: 'chamberR404aR23', expected: { cause: 'high-heat-load', stage: 'low' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('chamberR404aR23', 23), { cabinet: -48, runtime: 400, cascadeHx: -26, low: { sst: -70, sct: -20, superheat: 55, currentPct: 105 } }),
  },
  {
    id: 'T28', title: 'Cold trap, low-stage compressor will not start', source: CP('a compressor called to run but stopped at 0 A points to its electrics'), unit: 'trapR507aR1150', expected: { cause: 'compressor-electrical', stage: 'low' },
    symptoms: ['not-cooling', 'compressor-not-starting'],
    state: withState(healthy('trapR507aR1150', 22), { cabinet: -60, cascadeHx: -50, low: stopped, high: { sst: -54, currentPct: 70 } }),
  },
  {
    id: 'T29', title: 'ULT freezer, low stage trips at start, standing far above expected', source: CP('an isolated expansion tank leaves the low-stage gas in a smaller volume'), unit: 'ultR404aR170', expected: { cause: 'expansion-tank-fault', stage: 'low' },
    symptoms: ['compressor-tripping', 'intermittent-cooling'],
    state: withState(healthy('ultR404aR170', 21), {
      cabinet: -78,
      low: { standingKpa: standingPressureFromCharge({ designation: 'R170', ambientC: 21, volumeL: 5.5, chargeG: 210 }).pressureKpa },
    }),
  },
  {
    id: 'T30', title: 'ULT freezer, all as designed', source: CP('healthy readings at the design point'), unit: 'ultR404aR170', expected: { cause: 'no-refrigeration-fault' },
    state: withState(healthy('ultR404aR170', 21), { cabinet: -79, low: { standingFraction: 1 } }),
  },
  {
    id: 'T31', title: 'ULT freezer at design with its cabinet probe reading −20 °C', source: CP('a stage at its design evaporating temperature cannot carry a cabinet tens of kelvin warm'), unit: 'ultR404aR170', expected: { cause: 'control-sensor-fault', stage: 'low' },
    symptoms: ['not-cooling'],
    state: withState(healthy('ultR404aR170', 22), { cabinet: -20 }),
  },
  {
    id: 'T32', title: 'CO2 low stage overcharged after a top-up', source: KIM('overcharge'), unit: 'chamberR134aR744', expected: { cause: 'overcharge', stage: 'low' },
    symptoms: ['recently-serviced'],
    state: withState(healthy('chamberR134aR744', 22), { cabinet: -35, cascadeHx: -7, low: { sct: 5, subcooling: 12, superheat: 3, currentPct: 112, standingFraction: 1.3 } }),
  },
  {
    id: 'T33', title: 'R508B low stage with air drawn in at a line-tap valve', source: CP('air drawn into a sub-atmospheric low stage raises its head and its standing pressure'), unit: 'ultR507aR508b', expected: { cause: 'non-condensables', stage: 'low' },
    symptoms: ['line-tap-valve-present'],
    state: withState(healthy('ultR507aR508b', 22), {
      cabinet: -70,
      low: { sct: -15, subcooling: 12, currentPct: 105, standingKpa: 1.25 * standingPressureFromCharge({ designation: 'R508B', ambientC: 22, volumeL: 11, chargeG: 300 }).pressureKpa },
    }),
  },
  {
    id: 'T34', title: 'ULT freezer, worn high-stage compressor', source: RB97_CASCADE('compressor valve leakage'), unit: 'ultR134aR23', expected: { cause: 'compressor-inefficient', stage: 'high' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('ultR134aR23', 23), { cabinet: -58, cascadeHx: -17, high: { sst: -25, sct: 31, currentPct: 55, dischargeSuperheat: 80 }, low: { sst: -72, sct: -13 } }),
  },
  {
    id: 'T35', title: 'Ethane stage charged with ethylene by mistake', source: CP('an evaporator colder than the nameplate refrigerant can boil at that pressure, on another refrigerant’s curve; the heat exchangers still set the temperatures'), unit: 'ultR404aR170', expected: { cause: 'wrong-refrigerant', stage: 'low' },
    symptoms: ['recently-serviced', 'refrigerant-label-mismatch'],
    state: withState(healthy('ultR404aR170', 22), { cabinet: -70, low: { actual: 'R1150', sst: -84, sct: -27, evaporator: -83 } }),
  },
  {
    id: 'T36', title: 'Cold trap high-stage expansion valve underfeeding', source: KIM('expansion-device restriction'), unit: 'trapR507aR1150', expected: { cause: 'expansion-valve-underfeeding', stage: 'high' },
    symptoms: ['slow-pulldown'], unitPatch: txv('high'),
    state: withState(healthy('trapR507aR1150', 22), { cabinet: -85, cascadeHx: -33, high: { sst: -55, sct: 34, superheat: 20, subcooling: 8, currentPct: 72 }, low: { sst: -99, sct: -30 } }),
  },
  // ------------------------------------------------------------ more variety
  {
    id: 'T41', title: 'Chiller short of charge, readings in MPa', source: RB97('refrigerant leak'), unit: 'chillerR134a', expected: { cause: 'refrigerant-leak', stage: 'single' },
    symptoms: ['not-cooling'], show: { pressure: 'MPa' },
    state: withState(healthy('chillerR134a', 27), { cabinet: 16, airOut: 32, single: { sst: -7, sct: 36, superheat: 14, subcooling: 0.5, currentPct: 70 } }),
  },
  {
    id: 'T42', title: 'Fridge tripping on warm afternoons, condenser fan slow', source: RB97('condenser fouling'), unit: 'fridgeR134a', expected: { cause: 'condenser-airflow', stage: 'single' },
    symptoms: ['intermittent-cooling', 'compressor-tripping'],
    state: withState(healthy('fridgeR134a', 23), { cabinet: 9, airOut: 41, single: { sst: -3, sct: 52, superheat: 6, subcooling: 4, currentPct: 115 } }),
  },
  {
    id: 'T43', title: 'ULT freezer, ethane low stage standing at 30 %, psig', source: CP('a gas-charged low stage stands in proportion to its charge (isochore from the equation of state)'), unit: 'ultR290R170', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['not-cooling'], show: { pressure: 'psig' },
    state: { ambient: 22, cabinet: -40, low: { standingFraction: 0.3 } },
  },
  {
    id: 'T44', title: 'ULT freezer high-stage condenser matted with dust, bar gauges', source: RB97_CASCADE('condenser fouling'), unit: 'ultR404aR170', expected: { cause: 'condenser-airflow', stage: 'high' },
    symptoms: ['slow-pulldown'], show: { pressure: 'barg' },
    state: withState(healthy('ultR404aR170', 25), { cabinet: -66, cascadeHx: -22, airOut: 43, high: { sst: -29, sct: 57, subcooling: 5, currentPct: 120 }, low: { sst: -80, sct: -17, currentPct: 100 } }),
  },
  {
    id: 'T45', title: 'Cold trap ethylene stage short of charge, kPag', source: CP('a starved low stage: suction low, superheat high, head and current low'), unit: 'trapR404aR1150', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['not-cooling'], show: { pressure: 'kPag' },
    state: withState(healthy('trapR404aR1150', 22), { cabinet: -80, cascadeHx: -40, low: { sst: -120, sct: -37, superheat: 70, subcooling: 0.5, currentPct: 70 } }),
  },
  {
    id: 'T46', title: 'Test chamber, low-stage compressor not pumping', source: RB97_CASCADE('compressor valve leakage'), unit: 'chamberR404aR23', expected: { cause: 'compressor-inefficient', stage: 'low' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('chamberR404aR23', 23), { cabinet: -55, cascadeHx: -31, low: { sst: -74, sct: -26, currentPct: 55, dischargeSuperheat: 110 } }),
  },
  {
    id: 'T47', title: 'ULT freezer, standing check only, all as expected', source: CP('healthy standing pressure and cabinet at target'), unit: 'ultR134aR23', expected: { cause: 'no-refrigeration-fault' },
    state: { ambient: 22, cabinet: -79, low: { standingFraction: 1 } },
  },
  {
    id: 'T48', title: 'Chest freezer compressor drawing locked-rotor current and tripping', source: CP('a current far above rated with normal pressures points to the motor or its start gear'), unit: 'chestR290', expected: { cause: 'compressor-electrical', stage: 'single' },
    symptoms: ['compressor-tripping'],
    state: withState(healthy('chestR290'), { cabinet: -10, single: { sst: -22, sct: 40, currentPct: 170 } }),
  },
  {
    id: 'T49', title: 'Cold room with air in the condenser, at altitude, psig', source: KIM('non-condensable gas'), unit: 'coldRoomR404a', expected: { cause: 'non-condensables', stage: 'single' },
    symptoms: ['recently-serviced'], show: { pressure: 'psig', altitudeM: 1450 },
    state: withState(healthy('coldRoomR404a', 25), { cabinet: 5, single: { sct: 52, subcooling: 12, currentPct: 110 } }),
  },
  {
    id: 'T50', title: 'Freezer with a kinked capillary, °F', source: RB97('liquid-line restriction'), unit: 'freezerR404a', expected: { cause: 'restriction', stage: 'single' },
    symptoms: ['not-cooling'], show: { temperature: 'F' },
    state: withState(healthy('freezerR404a', 25), { cabinet: -18, airOut: 30, single: { sst: -52, sct: 38, superheat: 20, subcooling: 12, currentPct: 68 } }),
  },
  {
    id: 'T51', title: 'R508B low stage overcharged', source: KIM('overcharge'), unit: 'ultR507aR508b', expected: { cause: 'overcharge', stage: 'low' },
    symptoms: ['recently-serviced'],
    state: withState(healthy('ultR507aR508b', 22), { cabinet: -72, low: { sct: -18, subcooling: 12, superheat: 2, currentPct: 110, standingFraction: 1.35 } }),
  },
  {
    id: 'T52', title: 'Process chiller under a heavy process load', source: CP('a high load raises suction and superheat and keeps the compressor running'), unit: 'chillerR134a', expected: { cause: 'high-heat-load', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('chillerR134a', 27), { cabinet: 19, runtime: 500, airOut: 37, single: { sst: 6, sct: 45, superheat: 12, currentPct: 105 } }),
  },
  {
    id: 'T53', title: 'Fridge with a dead evaporator fan', source: RB97('evaporator fouling'), unit: 'fridgeR134a', expected: { cause: 'evaporator-airflow', stage: 'single' },
    symptoms: ['not-cooling'],
    state: withState(healthy('fridgeR134a', 23), { cabinet: 12, airOut: 30, single: { sst: -14, sct: 34, superheat: 2, subcooling: 5, currentPct: 80, evaporator: -13 } }),
  },
  {
    id: 'T54', title: 'ULT freezer, propane high stage with air after a repair', source: KIM('non-condensable gas'), unit: 'ultR290R1150', expected: { cause: 'non-condensables', stage: 'high' },
    symptoms: ['recently-serviced'],
    state: withState(healthy('ultR290R1150', 22), { cabinet: -68, cascadeHx: -27, high: { sct: 52, subcooling: 10, currentPct: 112 }, low: { sst: -82, sct: -24 } }),
  },
  {
    id: 'T55', title: 'ULT freezer, low stage off on its overload', source: CP('a compressor called to run but stopped at 0 A points to its electrics'), unit: 'ultR404aR170', expected: { cause: 'compressor-electrical', stage: 'low' },
    symptoms: ['not-cooling', 'compressor-tripping'],
    state: withState(healthy('ultR404aR170', 22), { cabinet: -40, cascadeHx: -40, low: stopped, high: { sst: -42, currentPct: 70 } }),
  },
  {
    id: 'T56', title: 'Chest freezer, all as designed, noisy instruments', source: CP('healthy readings at the design point'), unit: 'chestR290', expected: { cause: 'no-refrigeration-fault' },
    show: { noiseSeed: 56 },
    state: withState(healthy('chestR290'), { cabinet: -24.5 }),
  },
  {
    id: 'T57', title: 'Cold room running on and on, produce freezing', source: CP('a cabinet well below its setpoint with the compressor still running means the control is not stopping it'), unit: 'coldRoomR404a', expected: { cause: 'control-sensor-fault', stage: 'single' },
    state: withState(healthy('coldRoomR404a', 25), { cabinet: -6, runtime: 900, single: { sst: -14 } }),
  },
  {
    id: 'T58', title: 'Cold trap high stage losing charge', source: RB97_CASCADE('refrigerant leak'), unit: 'trapR507aR1150', expected: { cause: 'refrigerant-leak', stage: 'high' },
    symptoms: ['warming-over-days'],
    state: withState(healthy('trapR507aR1150', 22), { cabinet: -80, cascadeHx: -30, high: { sst: -55, sct: 31, superheat: 18, subcooling: 0.5, currentPct: 66 }, low: { sst: -94, sct: -25 } }),
  },
  {
    id: 'T59', title: 'R23 low stage blocking with ice after a repair', source: CP('moisture freezing at the low-stage capillary'), unit: 'ultR134aR23', expected: { cause: 'moisture-freeze', stage: 'low' },
    symptoms: ['intermittent-cooling', 'recently-serviced'],
    state: withState(healthy('ultR134aR23', 22), { cabinet: -55, low: { sst: -104, sct: -29, superheat: 65, subcooling: 8, currentPct: 72, standingFraction: 1 } }),
  },
  {
    id: 'T60', title: 'Freezer leak at altitude, noisy gauges, psig', source: RB97('refrigerant leak'), unit: 'freezerR290', expected: { cause: 'refrigerant-leak', stage: 'single' },
    symptoms: ['not-cooling'], show: { pressure: 'psig', altitudeM: 1200, noiseSeed: 60 },
    state: withState(healthy('freezerR290', 25), { cabinet: -9, airOut: 29, single: { sst: -38, sct: 34, superheat: 18, subcooling: 1, currentPct: 70 } }),
  },
  {
    id: 'T61', title: 'CO2 chamber, R134a high stage short of charge', source: RB97_CASCADE('refrigerant leak'), unit: 'chamberR134aR744', expected: { cause: 'refrigerant-leak', stage: 'high' },
    symptoms: ['not-cooling'],
    state: withState(healthy('chamberR134aR744', 22), { cabinet: -25, cascadeHx: 4, high: { sst: -22, sct: 33, superheat: 20, subcooling: 0.5, currentPct: 65 }, low: { sst: -39, sct: 8, currentPct: 105 } }),
  },
  {
    id: 'T62', title: 'Cold room charged with R22 instead of R404A', source: CP('a standing pressure on another refrigerant’s saturation curve identifies the charge'), unit: 'coldRoomR404a', expected: { cause: 'wrong-refrigerant', stage: 'single' },
    symptoms: ['recently-serviced'],
    state: { ambient: 20, cabinet: 8, single: { actual: 'R22', standingFraction: 1, running: false } },
  },
  {
    id: 'T63', title: 'Freezer with a torn door gasket', source: CP('a high load raises suction and superheat and keeps the compressor running'), unit: 'freezerR404a', expected: { cause: 'high-heat-load', stage: 'single' },
    symptoms: ['slow-pulldown'],
    state: withState(healthy('freezerR404a', 25), { cabinet: -20, runtime: 400, single: { sst: -34, sct: 42, superheat: 12, currentPct: 100 } }),
  },
  {
    id: 'T64', title: 'ULT freezer, cabinet warm, standing check recorded low', source: CP('a low standing pressure on a gas-charged low stage is the direct sign of a leak'), unit: 'ultR404aR170', expected: { cause: 'refrigerant-leak', stage: 'low' },
    symptoms: ['not-cooling'], tests: [{ test: 'standing-pressure-check', stage: 'low', outcome: 'low' }],
    state: { cabinet: -42, cascadeHx: -33, high: { running: true }, low: { running: true } },
  },
  {
    id: 'T65', title: 'ULT freezer, standing as expected, drop across the low-stage drier', source: CP('a marked temperature drop across the drier places the blockage'), unit: 'ultR290R170', expected: { cause: 'restriction', stage: 'low' },
    symptoms: ['not-cooling'], tests: [{ test: 'restriction-temperature-drop', stage: 'low', outcome: 'marked-drop' }],
    state: { ambient: 21, cabinet: -45, cascadeHx: -36, high: { running: true }, low: { running: true, standingFraction: 1 } },
  },
  {
    id: 'T66', title: 'Fridge reported warm, found at target and healthy', source: CP('healthy readings at the design point'), unit: 'fridgeR134a', expected: { cause: 'no-refrigeration-fault' },
    symptoms: ['not-cooling'],
    state: withState(healthy('fridgeR134a', 23), { cabinet: 5.5 }),
  },
  {
    id: 'T67', title: 'ULT freezer after service, low stage trips at start, standing more than twice the expected',
    source: CP('a low stage whose expansion tank was left shut off holds its charge in the rest of the circuit: a standing pressure far above the charge\'s and high-pressure trips at start; air let in during service adds only a little'),
    unit: 'ultR290R170', expected: { cause: 'expansion-tank-fault', stage: 'low' },
    symptoms: ['compressor-tripping', 'recently-serviced'],
    state: withState(healthy('ultR290R170', 22), {
      cabinet: -76,
      low: { standingKpa: standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 2.6, chargeG: 92 }).pressureKpa },
    }),
  },
  {
    id: 'T68', title: 'ULT freezer, high-stage compressor off on its overload minutes after a trip, gauges not yet equal',
    source: CP('a compressor seen stopped and drawing no current is stopped, whatever the gauges still show minutes after it stopped'),
    unit: 'ultR404aR170', expected: { cause: 'compressor-electrical', stage: 'high' },
    symptoms: ['compressor-tripping', 'not-cooling'],
    state: withState(healthy('ultR404aR170', 23), {
      cabinet: -55, cascadeHx: -5,
      high: { running: false, currentPct: 0, sst: -5, sct: 25, superheat: undefined, subcooling: undefined, dischargeSuperheat: undefined },
      low: stopped,
    }),
  },
  {
    id: 'T69', title: 'Fridge charged with R404A instead of R134a, tripping on high pressure',
    source: CP('a standing pressure on another refrigerant\'s saturation curve identifies the charge; one far above the nameplate curve is more than air let in adds, and a higher-pressure refrigerant trips a system built for a lower one'),
    unit: 'fridgeR134a', expected: { cause: 'wrong-refrigerant', stage: 'single' },
    symptoms: ['compressor-tripping'],
    state: { ambient: 22, cabinet: 10, single: { actual: 'R404A', standingFraction: 1, running: false } },
  },
]
