/**
 * Refrigerant catalogue: identity, safety class, GWP and caution sentences.
 * Critical point, valid range and molar mass come from the EOS data so they always match the model.
 *
 * Sources: ASHRAE 34 classes as recorded in CoolProp 8.0.0's fluid files, except R717 (B2L since ASHRAE 34
 * introduced the 2L subclass in 2010, from memory) and R600a/R14/R508B/R503 (from memory).
 * GWP100: IPCC AR4 values as in 40 CFR 98 Table A-1 (AR4 edition); AR5 values from memory where marked in
 * gwpNote; blends are mass-weighted sums as Reg. (EU) 517/2014 Annex IV prescribes. EU values: Reg. (EU)
 * 517/2014 Annex I/IV and Reg. (EU) 2024/573 Annex I (null where not verified). CFC-12 and CFC-13: AR4 Table 2.14
 * and AR5 Table 8.A.1 values, from memory.
 */
import { EOS_DATA } from './data/index'

export type Designation = 'R1150' | 'R170' | 'R290' | 'R600a' | 'R1270' | 'R50' | 'R14' | 'R23' | 'R116' | 'R508B' | 'R13' | 'R503' | 'R404A' | 'R507A' | 'R134a' | 'R22' | 'R12' | 'R410A' | 'R744' | 'R717'

export const DESIGNATIONS: readonly Designation[] = Object.freeze(['R1150', 'R170', 'R290', 'R600a', 'R1270', 'R50', 'R14', 'R23', 'R116', 'R508B', 'R13', 'R503', 'R404A', 'R507A', 'R134a', 'R22', 'R12', 'R410A', 'R744', 'R717'] as const)

export interface RefrigerantInfo {
  designation: Designation
  name: string
  safetyClass: string
  gwpAR4: number | null
  gwpAR5: number | null
  gwpNote?: string
  gwpEu2014: number | null
  gwpEu2024: number | null
  kind: 'pure' | 'blend'
  composition?: { component: string; massPercent: number }[]
  criticalTemperatureC: number
  criticalPressureKpa: number
  normalBoilingPointC: number
  normalBoilingPointDewC?: number
  molarMassGPerMol: number
  validRange: { minC: number; maxC: number }
  flammable: boolean
  toxic: boolean
  highPressure: boolean
  /** Chemical family, as the trade groups refrigerants for oil and regulation questions. */
  family: RefrigerantFamily
  /** Contains a chlorinated substance controlled under the Montreal Protocol. */
  ozoneDepleting: boolean
  cautions: string[]
  eosSource: string
}

/** CFC and HCFC: chlorinated (ozone-depleting); HFC and PFC: fluorinated; HC: hydrocarbons; natural: CO2 and ammonia. */
export type RefrigerantFamily = 'CFC' | 'HCFC' | 'HFC' | 'PFC' | 'HC' | 'natural'

interface Static {
  name: string
  safetyClass: string
  gwpAR4: number | null
  gwpAR5: number | null
  gwpNote?: string
  gwpEu2014: number | null
  gwpEu2024: number | null
  composition?: [string, number][]
  /** Normal boiling point from the model at 101.325 kPa (bubble, dew for blends); checked by the tests. */
  nbp: number | [number, number]
  /**
   * highPressure rule: saturation pressure at 20 °C of at least 1.4 MPa absolute (R410A and above), or no
   * liquid at all at 20 °C (critical temperature below 20 °C). Such fluids need gauges, hoses and
   * recovery cylinders rated for them. The tests recompute this rule from the model.
   */
  highPressure: boolean
  family: RefrigerantFamily
}

const NO_IPCC = 'IPCC AR4/AR5 main tables give no value; the figure is the regulatory value of Reg. (EU) 517/2014 Annex IV.'
const AR5_MEM = 'AR5 value from memory, not verified.'
const CFC = 'AR4 and AR5 values from memory. Ozone-depleting (CFC): regulated under the Montreal Protocol and the EU ozone regulation, not the EU F-gas rules.'

const STATIC: Record<Designation, Static> = {
  R1150: { name: 'ethylene', safetyClass: 'A3', gwpAR4: 4, gwpAR5: null, gwpNote: NO_IPCC, gwpEu2014: 4, gwpEu2024: null, nbp: -103.77, highPressure: true, family: 'HC' },
  R170: { name: 'ethane', safetyClass: 'A3', gwpAR4: 6, gwpAR5: null, gwpNote: NO_IPCC, gwpEu2014: 6, gwpEu2024: null, nbp: -88.58, highPressure: true, family: 'HC' },
  R290: { name: 'propane', safetyClass: 'A3', gwpAR4: 3, gwpAR5: null, gwpNote: `${NO_IPCC} Reg. (EU) 2024/573 uses the AR6 value 0.02.`, gwpEu2014: 3, gwpEu2024: 0.02, nbp: -42.11, highPressure: false, family: 'HC' },
  R600a: { name: 'isobutane', safetyClass: 'A3', gwpAR4: 3, gwpAR5: null, gwpNote: NO_IPCC, gwpEu2014: 3, gwpEu2024: null, nbp: -11.75, highPressure: false, family: 'HC' },
  R1270: { name: 'propylene', safetyClass: 'A3', gwpAR4: 2, gwpAR5: null, gwpNote: NO_IPCC, gwpEu2014: 2, gwpEu2024: null, nbp: -47.62, highPressure: false, family: 'HC' },
  R50: { name: 'methane', safetyClass: 'A3', gwpAR4: 25, gwpAR5: 28, gwpNote: 'AR5 28 without climate–carbon feedback (34 with it, from memory).', gwpEu2014: 25, gwpEu2024: null, nbp: -161.48, highPressure: true, family: 'HC' },
  R14: { name: 'tetrafluoromethane', safetyClass: 'A1', gwpAR4: 7390, gwpAR5: 6630, gwpNote: `${AR5_MEM} Reg. (EU) 2024/573 uses the AR6 value 7 380.`, gwpEu2014: 7390, gwpEu2024: 7380, nbp: -128.05, highPressure: true, family: 'PFC' },
  R23: { name: 'trifluoromethane', safetyClass: 'A1', gwpAR4: 14800, gwpAR5: 12400, gwpNote: AR5_MEM, gwpEu2014: 14800, gwpEu2024: 14800, nbp: -82.02, highPressure: true, family: 'HFC' },
  R116: { name: 'hexafluoroethane', safetyClass: 'A1', gwpAR4: 12200, gwpAR5: 11100, gwpNote: `${AR5_MEM} Reg. (EU) 2024/573 uses the AR6 value 12 400.`, gwpEu2014: 12200, gwpEu2024: 12400, nbp: -78.09, highPressure: true, family: 'PFC' },
  R508B: { name: 'R23/R116 azeotropic blend', safetyClass: 'A1', gwpAR4: 13396, gwpAR5: 11698, gwpNote: 'Mass-weighted sums of the components (AR5 component values from memory).', gwpEu2014: 13396, gwpEu2024: 13504, composition: [['R23', 46], ['R116', 54]], nbp: [-87.66, -87.28], highPressure: true, family: 'HFC' },
  R404A: { name: 'R125/R143a/R134a blend', safetyClass: 'A1', gwpAR4: 3922, gwpAR5: 3943, gwpNote: 'Mass-weighted sums of the components (AR5 component values from memory).', gwpEu2014: 3922, gwpEu2024: 3922, composition: [['R125', 44], ['R143a', 52], ['R134a', 4]], nbp: [-46.22, -45.47], highPressure: false, family: 'HFC' },
  R507A: { name: 'R125/R143a azeotropic blend', safetyClass: 'A1', gwpAR4: 3985, gwpAR5: 3985, gwpNote: 'Mass-weighted sums of the components (AR5 component values from memory).', gwpEu2014: 3985, gwpEu2024: 3985, composition: [['R125', 50], ['R143a', 50]], nbp: [-46.74, -46.74], highPressure: false, family: 'HFC' },
  R134a: { name: '1,1,1,2-tetrafluoroethane', safetyClass: 'A1', gwpAR4: 1430, gwpAR5: 1300, gwpNote: AR5_MEM, gwpEu2014: 1430, gwpEu2024: 1430, nbp: -26.07, highPressure: false, family: 'HFC' },
  R22: { name: 'chlorodifluoromethane', safetyClass: 'A1', gwpAR4: 1810, gwpAR5: 1760, gwpNote: 'AR4 and AR5 values from memory. An ozone-depleting HCFC, regulated as such rather than under the EU F-gas rules.', gwpEu2014: null, gwpEu2024: null, nbp: -40.81, highPressure: false, family: 'HCFC' },
  R410A: { name: 'R32/R125 blend', safetyClass: 'A1', gwpAR4: 2088, gwpAR5: 1924, gwpNote: 'Mass-weighted sums of the components (AR5 component values from memory).', gwpEu2014: 2088, gwpEu2024: 2088, composition: [['R32', 50], ['R125', 50]], nbp: [-51.44, -51.36], highPressure: true, family: 'HFC' },
  R744: { name: 'carbon dioxide', safetyClass: 'A1', gwpAR4: 1, gwpAR5: 1, gwpEu2014: 1, gwpEu2024: 1, nbp: -78.46, highPressure: true, family: 'natural' },
  R13: { name: 'chlorotrifluoromethane', safetyClass: 'A1', gwpAR4: 14400, gwpAR5: 13900, gwpNote: CFC, gwpEu2014: null, gwpEu2024: null, nbp: -81.41, highPressure: true, family: 'CFC' },
  R12: { name: 'dichlorodifluoromethane', safetyClass: 'A1', gwpAR4: 10900, gwpAR5: 10200, gwpNote: CFC, gwpEu2014: null, gwpEu2024: null, nbp: -29.75, highPressure: false, family: 'CFC' },
  R503: { name: 'R23/R13 azeotropic blend', safetyClass: 'A1', gwpAR4: 14560, gwpAR5: 13299, gwpNote: `Mass-weighted sums of the components (component values from memory). Contains CFC-13: ozone-depleting, so the EU F-gas figures are not given here.`, gwpEu2014: null, gwpEu2024: null, composition: [['R23', 40.1], ['R13', 59.9]], nbp: [-87.74, -87.74], highPressure: true, family: 'CFC' },
  R717: { name: 'ammonia', safetyClass: 'B2L', gwpAR4: 0, gwpAR5: null, gwpNote: NO_IPCC, gwpEu2014: 0, gwpEu2024: null, nbp: -33.32, highPressure: false, family: 'natural' },
}

/**
 * Blends computed as true mixtures have no EOS file: their critical point is that of our mixture model
 * (see blends.ts), kept here so the catalogue needs no phase-equilibrium solve; the tests recompute it.
 * Tmin is the higher component triple point; M follows from the component molar masses and mass fractions.
 */
export const MIXTURE_CONSTANTS: Partial<Record<Designation, { crit: { T: number; p: number; rho: number }; Tmin: number; M: number }>> = {
  R508B: { crit: { T: 284.5371, p: 3816111, rho: 6043.911 }, Tmin: 173.1, M: 0.09539402 },
  // R503 starts at −140 °C: its table reaches 3 K lower, and below about 130 K the model's bubble points no
  // longer converge reliably from a cold start (the blend is far from azeotropic there).
  R503: { crit: { T: 290.7295, p: 4207471, rho: 6376.557 }, Tmin: 133.15, M: 0.08724675 },
}

const K0 = 273.15

const MIXTURE_SOURCES: Partial<Record<Designation, string>> = {
  R508B: 'Multi-fluid mixture model (Kunz & Wagner 2012 form) of the R23 (Penoncello, Shan & Jacobsen 2003) and R116 (Lemmon & Span 2006) reference EOS with R116/R23 parameters of Bell & Lemmon 2016 (J. Chem. Eng. Data); coefficients as distributed in CoolProp 8.0.0 (MIT licence)',
  R503: 'Multi-fluid mixture model (Kunz & Wagner 2012 form) of the R23 (Penoncello, Shan & Jacobsen 2003) and R13 (Platzer, Polt & Maurer 1990) EOS with R13/R23 parameters of Bell & Lemmon 2016 (J. Chem. Eng. Data); coefficients as distributed in CoolProp 8.0.0 (MIT licence)',
}

function cautionsFor(d: Designation, s: Static, flammable: boolean, toxic: boolean, highPressure: boolean, tcC: number): string[] {
  const out: string[] = []
  if (toxic) out.push(`Toxic (${s.safetyClass}): ${d === 'R717' ? 'ammonia attacks eyes, skin and lungs; ' : ''}wear a full-face respirator rated for it or leave the area; ventilate and follow local codes.`)
  if (flammable) out.push(`Flammable (${s.safetyClass}): no ignition sources, ventilate, use tools and recovery equipment rated for flammable refrigerants; follow local codes.`)
  out.push('Cold burns: liquid and expanding gas cause frostbite; wear gloves and eye protection.')
  if (highPressure) out.push('High pressure at room temperature: use gauges, hoses and recovery cylinders rated for it.')
  if (tcC < 35) out.push(`Above ${tcC.toFixed(1)} °C (critical temperature) it cannot be liquid: a standing system's pressure then depends on the charge, not on a saturation table.`)
  out.push('Displaces oxygen in enclosed spaces: ventilate pits and small rooms before entering.')
  if (!flammable && d !== 'R744') out.push('Do not expose to flames or hot surfaces: it decomposes into toxic gases such as hydrogen fluoride.')
  if (s.family === 'CFC') out.push('Ozone-depleting CFC: its production has ended; recover it for reclaiming or destruction, never vent it, and fill only with recovered and reclaimed stock where local rules allow.')
  else if (s.family === 'HCFC') out.push('Ozone-depleting: recover it; venting is prohibited.')
  else if ((s.gwpAR4 ?? 0) > 150) out.push('High global-warming potential: recover it; venting is prohibited.')
  return out
}

function build(d: Designation): RefrigerantInfo {
  const s = STATIC[d]
  const data = EOS_DATA[d]
  const mixture = MIXTURE_CONSTANTS[d]
  if (!data && !mixture) throw new Error(`${d}: no equation of state`)
  const crit = data ? data.crit : mixture!.crit
  const Tmin = data ? Math.max(data.Ttriple, data.anc.pL?.Tmin ?? 0) : mixture!.Tmin
  const flammable = /^[AB](2L|2|3)$/.test(s.safetyClass)
  const toxic = s.safetyClass.startsWith('B')
  const tcC = crit.T - K0
  const nbp = s.nbp
  return {
    designation: d,
    name: s.name,
    safetyClass: s.safetyClass,
    gwpAR4: s.gwpAR4,
    gwpAR5: s.gwpAR5,
    ...(s.gwpNote ? { gwpNote: s.gwpNote } : {}),
    gwpEu2014: s.gwpEu2014,
    gwpEu2024: s.gwpEu2024,
    kind: s.composition ? 'blend' : 'pure',
    ...(s.composition ? { composition: s.composition.map(([component, massPercent]) => ({ component, massPercent })) } : {}),
    criticalTemperatureC: tcC,
    criticalPressureKpa: crit.p / 1000,
    normalBoilingPointC: Array.isArray(nbp) ? nbp[0] : nbp,
    ...(Array.isArray(nbp) ? { normalBoilingPointDewC: nbp[1] } : {}),
    molarMassGPerMol: (data ? data.M : mixture!.M) * 1000,
    validRange: { minC: Tmin - K0, maxC: tcC },
    flammable,
    toxic,
    highPressure: s.highPressure,
    family: s.family,
    ozoneDepleting: s.family === 'CFC' || s.family === 'HCFC',
    cautions: cautionsFor(d, s, flammable, toxic, s.highPressure, tcC),
    eosSource: data ? data.source : MIXTURE_SOURCES[d]!,
  }
}

const INFO: Map<Designation, RefrigerantInfo> = new Map(DESIGNATIONS.map((d) => [d, build(d)]))
const LOWER: Map<string, Designation> = new Map(DESIGNATIONS.map((d) => [d.toLowerCase(), d]))

/** True if s is exactly one of the supported designations. */
export function isDesignation(s: string): s is Designation {
  return INFO.has(s as Designation)
}

/** All refrigerants, in catalogue order (copies: callers may mutate them). */
export function listRefrigerants(): RefrigerantInfo[] {
  return DESIGNATIONS.map((d) => structuredCloneInfo(INFO.get(d)!))
}

/** Look up a refrigerant by designation, exact or case-insensitive ('r23'); also accepts 'R-23'. */
export function findRefrigerant(designation: string): RefrigerantInfo | undefined {
  if (typeof designation !== 'string') return undefined
  const key = designation.trim().toLowerCase().replace(/^r-/, 'r')
  const d = LOWER.get(key)
  return d ? structuredCloneInfo(INFO.get(d)!) : undefined
}

/**
 * Designations a search text stands for: those with a word of the name starting with it ("ethylene"
 * → R1150, "ethane" → R170 but not methane, "blend" → every blend) and the one it names with or
 * without its hyphen ("R-1150"). Empty for fewer than three letters, so a stray letter matches nothing.
 */
export function designationsMatching(text: string): Designation[] {
  const words = (s: string) => ` ${s.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim()}`
  const q = text.trim().toLowerCase()
  if (q.length < 3) return []
  const named = LOWER.get(q.replace(/^r-/, 'r'))
  return DESIGNATIONS.filter((d) => d === named || words(INFO.get(d)!.name).includes(words(q)))
}

function structuredCloneInfo(i: RefrigerantInfo): RefrigerantInfo {
  return { ...i, validRange: { ...i.validRange }, cautions: [...i.cautions], ...(i.composition ? { composition: i.composition.map((c) => ({ ...c })) } : {}) }
}

/** Internal: catalogue entry without copying. */
export const infoOf = (d: Designation): RefrigerantInfo | undefined => INFO.get(d)
