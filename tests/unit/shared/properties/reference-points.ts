/**
 * Reference points shared by the property tests and scripts/accuracy.ts.
 * Saturation pressures (T °C → p kPa abs) and gas densities were computed with CoolProp 8.0.0 from the
 * reference equations of state named per fluid (the same EOS families NIST REFPROP/WebBook use); the
 * cross-checks against independent tables are named where they exist.
 */
import type { Designation } from '#shared/utils/properties'

export interface SatPoint { c: number; kpa: number; dewKpa?: number }
export interface FluidRef { source: string; sat: SatPoint[] }

export const SATURATION: Record<Designation, FluidRef> = {
  // Smukala, Span & Wagner 2000 reference EOS, values as computed with CoolProp 8.0.0
  R1150: { source: 'Smukala et al. 2000 EOS via CoolProp 8.0.0', sat: [{ c: -103.77, kpa: 101.33 }, { c: -100, kpa: 125.85 }, { c: -90, kpa: 213.2 }, { c: -80, kpa: 340.34 }, { c: -60, kpa: 754.06 }, { c: -40, kpa: 1452.1 }, { c: -20, kpa: 2528.4 }, { c: 0, kpa: 4099.0 }] },
  // Bücker & Wagner 2006 (ethane) reference EOS, values as computed with CoolProp 8.0.0
  R170: { source: 'Bücker & Wagner 2006 EOS via CoolProp 8.0.0', sat: [{ c: -100, kpa: 52.295 }, { c: -88.58, kpa: 101.33 }, { c: -80, kpa: 157.41 }, { c: -60, kpa: 378.77 }, { c: -40, kpa: 777.44 }, { c: -20, kpa: 1421.5 }, { c: 0, kpa: 2386.7 }, { c: 20, kpa: 3765.5 }] },
  // Lemmon, McLinden & Wagner 2009 (propane) EOS via CoolProp 8.0.0
  R290: { source: 'Lemmon et al. 2009 EOS via CoolProp 8.0.0', sat: [{ c: -42.11, kpa: 101.34 }, { c: -40, kpa: 111.12 }, { c: -20, kpa: 244.52 }, { c: 0, kpa: 474.46 }, { c: 25, kpa: 952.07 }, { c: 40, kpa: 1369.4 }] },
  // Bücker & Wagner 2006 (isobutane) EOS via CoolProp 8.0.0
  R600a: { source: 'Bücker & Wagner 2006 EOS via CoolProp 8.0.0', sat: [{ c: -20, kpa: 72.477 }, { c: -11.75, kpa: 101.32 }, { c: 0, kpa: 156.96 }, { c: 25, kpa: 350.67 }, { c: 40, kpa: 531.21 }] },
  // Lemmon et al. propylene EOS via CoolProp 8.0.0
  R1270: { source: 'Lemmon et al. propylene EOS via CoolProp 8.0.0', sat: [{ c: -47.62, kpa: 101.32 }, { c: -40, kpa: 141.47 }, { c: -20, kpa: 305.62 }, { c: 0, kpa: 584.09 }, { c: 25, kpa: 1154.4 }, { c: 40, kpa: 1648.4 }] },
  // Setzmann & Wagner 1991 (methane) EOS via CoolProp 8.0.0
  R50: { source: 'Setzmann & Wagner 1991 EOS via CoolProp 8.0.0', sat: [{ c: -161.48, kpa: 101.35 }, { c: -150, kpa: 237.84 }, { c: -120, kpa: 1195.9 }, { c: -100, kpa: 2604.0 }, { c: -90, kpa: 3639.9 }] },
  // Platzer, Polt & Maurer 1990 (R14) EOS via CoolProp 8.0.0
  R14: { source: 'Platzer et al. 1990 EOS via CoolProp 8.0.0', sat: [{ c: -128.05, kpa: 101.29 }, { c: -120, kpa: 172.63 }, { c: -100, kpa: 513.54 }, { c: -80, kpa: 1205.1 }, { c: -60, kpa: 2421.8 }] },
  // Penoncello, Shan & Jacobsen 2003 (R23) EOS via CoolProp 8.0.0
  R23: { source: 'Penoncello et al. 2003 EOS via CoolProp 8.0.0', sat: [{ c: -100, kpa: 31.568 }, { c: -82, kpa: 101.43 }, { c: -80, kpa: 113.7 }, { c: -60, kpa: 311.88 }, { c: -40, kpa: 706.53 }, { c: -30, kpa: 1007.4 }, { c: 0, kpa: 2494.7 }, { c: 20, kpa: 4161.0 }] },
  // Lemmon & Span 2006 (R116) EOS via CoolProp 8.0.0
  R116: { source: 'Lemmon & Span 2006 EOS via CoolProp 8.0.0', sat: [{ c: -90, kpa: 50.888 }, { c: -78.09, kpa: 101.33 }, { c: -60, kpa: 243.94 }, { c: -40, kpa: 540.31 }, { c: -20, kpa: 1047.0 }, { c: 0, kpa: 1844.0 }] },
  // Mixture model (Kunz–Wagner form, Bell & Lemmon 2016 R116/R23 parameters) as computed with CoolProp 8.0.0; bubble/dew
  R508B: { source: 'CoolProp 8.0.0 mixture model R23/R116 46/54', sat: [{ c: -100, kpa: 46.8, dewKpa: 44.8 }, { c: -90, kpa: 88.3, dewKpa: 86.1 }, { c: -80, kpa: 154.6, dewKpa: 152.5 }, { c: -60, kpa: 397.3, dewKpa: 396.1 }, { c: -40, kpa: 857.3, dewKpa: 857.0 }, { c: -20, kpa: 1633, dewKpa: 1633 }] },
  // Lemmon 2003 pseudo-pure R404A bubble/dew equations via CoolProp 8.0.0
  R404A: { source: 'Lemmon 2003 pseudo-pure EOS via CoolProp 8.0.0', sat: [{ c: -50, kpa: 84.24, dewKpa: 81.01 }, { c: -40, kpa: 135.29, dewKpa: 130.98 }, { c: -20, kpa: 307.1, dewKpa: 300.18 }, { c: 0, kpa: 610.18, dewKpa: 600.27 }, { c: 25, kpa: 1254.6, dewKpa: 1241.2 }, { c: 40, kpa: 1829.5, dewKpa: 1814.9 }] },
  // Lemmon 2003 pseudo-pure R507A bubble/dew equations via CoolProp 8.0.0
  R507A: { source: 'Lemmon 2003 pseudo-pure EOS via CoolProp 8.0.0', sat: [{ c: -50, kpa: 86.38, dewKpa: 86.37 }, { c: -40, kpa: 138.68, dewKpa: 138.66 }, { c: -20, kpa: 314.52, dewKpa: 314.38 }, { c: 0, kpa: 624.39, dewKpa: 623.97 }, { c: 25, kpa: 1282.6, dewKpa: 1281.5 }, { c: 40, kpa: 1869.5, dewKpa: 1867.9 }] },
  // Tillner-Roth & Baehr 1994 (R134a) EOS via CoolProp 8.0.0; -100/-80 °C agree with an independent published R134a table
  R134a: { source: 'Tillner-Roth & Baehr 1994 EOS via CoolProp 8.0.0', sat: [{ c: -100, kpa: 0.5594 }, { c: -80, kpa: 3.6719 }, { c: -40, kpa: 51.209 }, { c: -26.07, kpa: 101.34 }, { c: 0, kpa: 292.8 }, { c: 25, kpa: 665.38 }, { c: 40, kpa: 1016.6 }] },
  // Kamei, Beyerlein & Jacobsen 1995 (R22) EOS via CoolProp 8.0.0
  R22: { source: 'Kamei et al. 1995 EOS via CoolProp 8.0.0', sat: [{ c: -40.81, kpa: 101.33 }, { c: -20, kpa: 245.31 }, { c: 0, kpa: 497.99 }, { c: 25, kpa: 1043.9 }, { c: 40, kpa: 1533.6 }] },
  // Lemmon 2003 pseudo-pure R410A bubble/dew equations via CoolProp 8.0.0
  R410A: { source: 'Lemmon 2003 pseudo-pure EOS via CoolProp 8.0.0', sat: [{ c: -50, kpa: 108.98, dewKpa: 108.55 }, { c: -40, kpa: 175.5, dewKpa: 174.85 }, { c: -20, kpa: 400.69, dewKpa: 399.3 }, { c: 0, kpa: 800.71, dewKpa: 798.08 }, { c: 25, kpa: 1657.2, dewKpa: 1652.1 }, { c: 40, kpa: 2425.6, dewKpa: 2418.6 }] },
  // Span & Wagner 1996 (CO2) EOS via CoolProp 8.0.0; -20 and 0 °C agree with the Ohio University CO2 table
  R744: { source: 'Span & Wagner 1996 EOS via CoolProp 8.0.0', sat: [{ c: -56.558, kpa: 517.96 }, { c: -40, kpa: 1004.5 }, { c: -20, kpa: 1969.6 }, { c: 0, kpa: 3485.1 }, { c: 20, kpa: 5729.1 }, { c: 30, kpa: 7213.7 }] },
  // Platzer, Polt & Maurer 1990 (R13) EOS via CoolProp 8.0.0
  R13: { source: 'Platzer et al. 1990 EOS via CoolProp 8.0.0', sat: [{ c: -100, kpa: 33.198 }, { c: -81.5, kpa: 100.85 }, { c: -60, kpa: 280.15 }, { c: -40, kpa: 602.85 }, { c: -20, kpa: 1142.2 }, { c: 0, kpa: 1971 }, { c: 20, kpa: 3182 }] },
  // Marx, Pruß & Wagner 1992 (R12) EOS via CoolProp 8.0.0
  R12: { source: 'Marx et al. 1992 EOS via CoolProp 8.0.0', sat: [{ c: -60, kpa: 22.615 }, { c: -40, kpa: 64.087 }, { c: -29.8, kpa: 101.12 }, { c: -20, kpa: 150.7 }, { c: 0, kpa: 308.15 }, { c: 25, kpa: 650.57 }, { c: 50, kpa: 1216.6 }] },
  // Mixture model (Kunz–Wagner form, Bell & Lemmon 2016 R13/R23 parameters) as computed with CoolProp 8.0.0 (HEOS backend, R13&R23 at 40.1/59.9 mass %); bubble/dew
  R503: { source: 'CoolProp 8.0.0 mixture model R23/R13 40.1/59.9', sat: [{ c: -100, kpa: 47.566, dewKpa: 47.528 }, { c: -90, kpa: 88.919, dewKpa: 88.914 }, { c: -80, kpa: 154.53, dewKpa: 154.37 }, { c: -60, kpa: 392.91, dewKpa: 391.20 }, { c: -40, kpa: 840.47, dewKpa: 834.36 }, { c: -20, kpa: 1587.6, dewKpa: 1573.4 }, { c: 0, kpa: 2741.0, dewKpa: 2717.7 }] },
  // Gao et al. 2020 (ammonia) EOS via CoolProp 8.0.0 (NIST WebBook uses Tillner-Roth 1993: ~0.3 % apart)
  R717: { source: 'Gao et al. 2020 EOS via CoolProp 8.0.0', sat: [{ c: -40, kpa: 71.633 }, { c: -33.33, kpa: 101.25 }, { c: 0, kpa: 429.25 }, { c: 25, kpa: 1002.7 }, { c: 40, kpa: 1554.5 }] },
}

/** Gas density ρ (kg/m³) at 20 and 25 °C and 0.5/1.0/1.5 MPa, computed with CoolProp 8.0.0 from the fluids' EOS. */
export const GAS_DENSITY: Partial<Record<Designation, { c: number; kpa: number; rho: number }[]>> = Object.fromEntries(
  (Object.entries({
    R1150: [5.935, 12.271, 19.081, 5.826, 12.022, 18.65],
    R170: [6.429, 13.463, 21.278, 6.307, 13.171, 20.739],
    R23: [14.982, 31.401, 49.654, 14.693, 30.698, 48.341],
    R116: [30.02, 64.328, 104.98, 29.411, 62.702, 101.52],
    R14: [18.415, 37.584, 57.555, 18.084, 36.861, 56.368],
    R50: [3.321, 6.705, 10.151, 3.264, 6.585, 9.963],
    R744: [9.276, 19.099, 29.558, 9.107, 18.716, 28.906],
    R508B: [20.444, 42.923, 68.006, 20.048, 41.952, 66.179],
    R13: [22.5436, 47.7997, 76.8327, 22.0992, 46.6689, 74.5837],
    R503: [18.6779, 39.1718, 61.9905, 18.3181, 38.2944, 60.3499],
  }) as [Designation, number[]][]).map(([d, v]) => [d, v.map((rho, i) => ({ c: i < 3 ? 20 : 25, kpa: [500, 1000, 1500][i % 3]!, rho }))]),
)
// R12 condenses at 0.57 MPa at 20 °C: its gas points are at 0.2/0.3/0.5 MPa (Marx et al. 1992 EOS via CoolProp 8.0.0).
GAS_DENSITY.R12 = [10.3413, 15.8688, 27.8318, 10.1444, 15.5448, 27.1638].map((rho, i) => ({ c: i < 3 ? 20 : 25, kpa: [200, 300, 500][i % 3]!, rho }))

/**
 * Cross-checks against sources independent of the equation of state the module uses. Each names its source;
 * `tolPercent` is the agreement the source's own accuracy allows.
 */
export interface IndependentCheck { d: Designation; source: string; tolPercent: number; sat: SatPoint[] }
export const INDEPENDENT: IndependentCheck[] = [
  // Vapour-pressure equation fitted to the measurements and EOS of Magee, Outcalt & Ely 2000 (Int. J. Thermophys. 21,
  // 1097–1121; 92–350 K), Tc 302.0 K, pc 3879 kPa, n = −6.9311, 1.8281, −2.1901, −3.8177, 2.0803 on θ^1, 1.5, 2.5, 6, 8
  // (the form REFPROP uses, coefficients as distributed with the pychemqt library); values computed from it.
  {
    d: 'R13', source: 'Magee, Outcalt & Ely 2000 vapour-pressure equation (R13 measurements 92–350 K)', tolPercent: 0.5,
    sat: [{ c: -100, kpa: 33.240 }, { c: -81.48, kpa: 101.293 }, { c: -60, kpa: 281.03 }, { c: -40, kpa: 603.80 }, { c: -20, kpa: 1141.56 }, { c: 0, kpa: 1966.71 }, { c: 20, kpa: 3175.45 }],
  },
  // Çengel & Boles, Thermodynamics: An Engineering Approach, saturated refrigerant-12 table (older editions), from memory.
  {
    d: 'R12', source: 'Çengel & Boles refrigerant-12 saturation table (from memory)', tolPercent: 0.3,
    sat: [{ c: -40, kpa: 64.17 }, { c: -20, kpa: 150.93 }, { c: 0, kpa: 308.61 }, { c: 20, kpa: 567.29 }, { c: 40, kpa: 960.65 }],
  },
]
