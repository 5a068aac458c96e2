/**
 * Builders for physically consistent test scenarios: pressures are taken from the property module's
 * saturation curves, so a scenario states temperatures the way a technician thinks about them.
 */
import { join } from 'node:path'
import { saturationPressure, standingPressureFromCharge, type Designation } from '#shared/utils/properties'
import type { RankRequest, Reading, Stage, Symptom } from '#shared/types/diagnosis'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import type { KnowledgeBase } from '#server/domain/diagnosis/knowledge-base'

let seed: KnowledgeBase | undefined
export function seedKb(): KnowledgeBase {
  seed ??= { ...loadKnowledgeBaseFromDirectory(join(process.cwd(), 'content-src')), version: { id: 'seed-test', label: 'seed', status: 'draft' } }
  return seed
}

export const satKpa = (d: Designation, tC: number): number => saturationPressure(d, tC).dewKpa

const kpa = (quantity: Reading['quantity'], stage: Stage, value: number): Reading => ({ quantity, stage, value: Math.round(value * 10) / 10, unit: 'kPa' })
const degC = (quantity: Reading['quantity'], value: number, stage?: Stage): Reading => (stage ? { quantity, stage, value, unit: 'C' } : { quantity, value, unit: 'C' })

export interface RunningStage {
  d: Designation
  stage: Stage
  sstC: number
  sctC: number
  superheatK: number
  subcoolingK: number
  dischargeSuperheatK?: number
  currentA?: number
  evaporatorC?: number
}

/** Readings of a running stage from its saturated temperatures, superheat and subcooling. */
export function runningReadings(s: RunningStage): Reading[] {
  const out: Reading[] = [
    kpa('suctionPressure', s.stage, satKpa(s.d, s.sstC)),
    kpa('dischargePressure', s.stage, satKpa(s.d, s.sctC)),
    degC('suctionTemperature', s.sstC + s.superheatK, s.stage),
    degC('liquidLineTemperature', s.sctC - s.subcoolingK, s.stage),
    degC('dischargeTemperature', s.sctC + (s.dischargeSuperheatK ?? 45), s.stage),
    { quantity: 'compressorRunning', stage: s.stage, value: true, unit: 'bool' },
  ]
  if (s.currentA !== undefined) out.push({ quantity: 'compressorCurrent', stage: s.stage, value: s.currentA, unit: 'A' })
  if (s.evaporatorC !== undefined) out.push(degC('evaporatorTemperature', s.evaporatorC, s.stage))
  return out
}

export interface FreezerCase {
  sstC: number
  sctC: number
  superheatK: number
  subcoolingK: number
  currentPct: number
  airOutC: number
  cabinetC: number
  dischargeSuperheatK?: number
  evaporatorC?: number
  symptoms?: Symptom[]
}

/** A single-stage R290 freezer, design −20 °C, in a 25 °C room; rated current 5 A. */
export function singleStageFreezer(c: FreezerCase): RankRequest {
  return {
    unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290', ratedCurrentA: 5 }], design: { cabinetC: -20 } },
    symptoms: c.symptoms ?? [],
    readings: [
      ...runningReadings({ d: 'R290', stage: 'single', ...c, currentA: (5 * c.currentPct) / 100 }),
      degC('ambientTemperature', 25),
      degC('condenserAirInTemperature', 25),
      degC('condenserAirOutTemperature', c.airOutC),
      degC('cabinetTemperature', c.cabinetC),
      degC('setpointTemperature', -20),
    ],
  }
}

export const LOW_CHARGE = { refrigerant: 'R1150', chargeG: 250, volumeL: 9.5 } as const

/** Standing pressure the nameplate low-stage charge gives at `ambientC`. */
export function expectedLowStanding(ambientC: number): number {
  return standingPressureFromCharge({ designation: 'R1150', ambientC, volumeL: LOW_CHARGE.volumeL, chargeG: LOW_CHARGE.chargeG }).pressureKpa
}

export interface CascadeCase {
  cabinetC: number
  cascadeHxC: number
  lowStandingKpa?: number
  symptoms?: Symptom[]
  extra?: Reading[]
}

/** A −80 °C lab freezer: high stage R290, low stage R1150 (250 g in 9.5 L), cascade HX design −35 °C, 21 °C room. */
export function cascadeFreezer(c: CascadeCase): RankRequest {
  const readings: Reading[] = [
    degC('ambientTemperature', 21),
    degC('cabinetTemperature', c.cabinetC),
    degC('setpointTemperature', -80),
    degC('cascadeHxTemperature', c.cascadeHxC),
    { quantity: 'compressorRunning', stage: 'high', value: true, unit: 'bool' },
    { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
    ...(c.extra ?? []),
  ]
  if (c.lowStandingKpa !== undefined) readings.push(kpa('standingPressure', 'low', c.lowStandingKpa))
  return {
    unit: {
      kind: 'cascade',
      stages: [
        { stage: 'high', refrigerant: 'R290', chargeG: 600 },
        { stage: 'low', ...LOW_CHARGE },
      ],
      design: { cabinetC: -80, cascadeHxC: -35 },
    },
    symptoms: c.symptoms ?? ['not-cooling'],
    readings,
  }
}
