/**
 * Trade checks: fault signatures with physically consistent readings must rank the fault first
 * (or in the first two where the source says the signature is shared with another fault).
 */
import { describe, expect, it } from 'vitest'
import type { RankResponse } from '#shared/types/diagnosis'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { cascadeFreezer, expectedLowStanding, satKpa, seedKb, singleStageFreezer, type FreezerCase } from './scenario-helpers'

const top = (r: RankResponse, n: number) => r.causes.slice(0, n).map((c) => (c.stage ? `${c.cause}@${c.stage}` : c.cause))
const rank = (req: Parameters<typeof rankDiagnosis>[1]) => rankDiagnosis(seedKb(), req)

// Healthy reference for the freezer in singleStageFreezer(): SST −30 °C, SCT 40 °C, SH 6 K, SC 5 K, air ΔT 8 K, 100 % current.
const CASES: { fault: string; source: string; within: number; c: FreezerCase }[] = [
  {
    fault: 'refrigerant-leak@single',
    source: 'Rossi & Braun 1997, HVAC&R Research, fault-signature table: leak/undercharge → suction ↓, superheat ↑, subcooling ↓, condensing ↓',
    within: 1,
    c: { sstC: -38, sctC: 33, superheatK: 22, subcoolingK: 0.5, currentPct: 70, airOutC: 31, cabinetC: -8 },
  },
  {
    fault: 'overcharge@single',
    source: 'Rossi & Braun 1997, HVAC&R Research, fault-signature table (overcharge row, from memory): condensing ↑, subcooling ↑, superheat ↓',
    within: 1,
    c: { sstC: -26, sctC: 50, superheatK: 1.5, subcoolingK: 12, currentPct: 118, airOutC: 34, cabinetC: -14 },
  },
  {
    fault: 'restriction@single',
    source: 'Rossi & Braun 1997, HVAC&R Research, fault-signature table: liquid-line restriction → suction ↓, superheat ↑, subcooling ↑',
    within: 1,
    c: { sstC: -40, sctC: 36, superheatK: 18, subcoolingK: 12, currentPct: 65, airOutC: 31, cabinetC: -8 },
  },
  {
    fault: 'condenser-airflow@single',
    source: 'Rossi & Braun 1997, HVAC&R Research, fault-signature table: condenser fouling → condensing ↑, condenser air ΔT ↑',
    within: 1,
    c: { sstC: -28, sctC: 52, superheatK: 7, subcoolingK: 6, currentPct: 120, airOutC: 42, cabinetC: -12 },
  },
  {
    fault: 'evaporator-airflow@single',
    source: 'Rossi & Braun 1997, HVAC&R Research, fault-signature table: evaporator fouling → suction ↓, superheat ↓',
    within: 1,
    c: { sstC: -40, sctC: 37, superheatK: 1, subcoolingK: 5, currentPct: 85, airOutC: 33, cabinetC: -5, evaporatorC: -39 },
  },
  {
    fault: 'compressor-inefficient@single',
    source: 'Rossi & Braun 1997, HVAC&R Research, fault-signature table: compressor valve leakage → suction ↑, condensing ↓; low ratio and current: common practice, no source',
    within: 1,
    c: { sstC: -22, sctC: 32, superheatK: 9, subcoolingK: 4, currentPct: 50, airOutC: 30, cabinetC: -6, dischargeSuperheatK: 85 },
  },
  {
    fault: 'non-condensables@single',
    source: 'common practice, no source: head high with condensing far above the air while the air-side ΔT is normal; shares the high-head signature with condenser airflow and overcharge',
    within: 2,
    c: { sstC: -29, sctC: 50, superheatK: 8, subcoolingK: 12, currentPct: 112, airOutC: 33, cabinetC: -14 },
  },
]

describe('single-stage fault signatures', () => {
  for (const { fault, source, within, c } of CASES) {
    it(`${fault} ranks within the first ${within} — ${source}`, async () => {
      const r = await rank(singleStageFreezer(c))
      expect(top(r, within), JSON.stringify(top(r, 4))).toContain(fault)
    })
  }
})

describe('cascade −80 °C freezer, low stage not cooling, cascade HX at design, both compressors running', () => {
  const expected = expectedLowStanding(21)

  it('low standing pressure far below expected → refrigerant-leak on low first (common practice, no source)', async () => {
    const r = await rank(cascadeFreezer({ cabinetC: -45, cascadeHxC: -36, lowStandingKpa: expected * 0.4 }))
    expect(top(r, 1), JSON.stringify(top(r, 4))).toEqual(['refrigerant-leak@low'])
    expect(r.causes[0]?.evidence.map((e) => e.text).join(' ')).toMatch(/Low stage standing pressure \d+ kPa is 40\.0 % of the \d+ kPa expected at 21\.0 °C/)
  })

  it('low standing pressure as expected → a low-stage blockage first (common practice, no source)', async () => {
    const r = await rank(cascadeFreezer({ cabinetC: -45, cascadeHxC: -36, lowStandingKpa: expected * 1.01 }))
    expect(['restriction@low', 'moisture-freeze@low', 'oil-return-blocked@low'], JSON.stringify(top(r, 4))).toContain(top(r, 1)[0])
    expect(r.causes.find((c) => c.cause === 'refrigerant-leak' && c.stage === 'low')?.evidenceAgainst.length).toBeGreaterThan(0)
  })

  it('no standing pressure given → the first proposed test is the standing-pressure check on the low stage (common practice, no source)', async () => {
    const r = await rank(cascadeFreezer({ cabinetC: -45, cascadeHxC: -36 }))
    expect(r.tests[0], JSON.stringify(r.tests.slice(0, 3))).toMatchObject({ test: 'standing-pressure-check', stage: 'low' })
    expect(r.missingReadings.some((m) => m.quantity === 'standingPressure' && m.stage === 'low')).toBe(true)
  })

  it('a warm cascade heat exchanger → a high-stage cause first (common practice, no source)', async () => {
    const r = await rank(cascadeFreezer({ cabinetC: -30, cascadeHxC: -12 }))
    expect(r.causes[0]?.stage, JSON.stringify(top(r, 4))).toBe('high')
  })

  it('after a low standing pressure, the leak search on the low stage is proposed ahead of opening the system (common practice, no source)', async () => {
    const r = await rank(cascadeFreezer({ cabinetC: -45, cascadeHxC: -36, lowStandingKpa: expected * 0.4 }))
    const leakSearch = r.tests.findIndex((t) => t.test === 'leak-search' && t.stage === 'low')
    const nitrogen = r.tests.findIndex((t) => t.test === 'nitrogen-pressure-test' && t.stage === 'low')
    expect(leakSearch).toBeGreaterThanOrEqual(0)
    expect(nitrogen === -1 || leakSearch < nitrogen).toBe(true)
  })
})

describe('refrigerant identity from a saturated pressure–temperature pair', () => {
  it('a standing pressure that fits another refrigerant raises wrong-refrigerant (common practice, no source: compare the pair with each candidate curve)', async () => {
    // Nameplate R134a, but the stopped system at 22 °C stands at the R290 saturation pressure.
    const r = await rank({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R134a' }], design: { cabinetC: -20 } },
      symptoms: ['not-cooling'],
      readings: [
        { quantity: 'ambientTemperature', value: 22, unit: 'C' },
        { quantity: 'standingPressure', stage: 'single', value: Math.round(satKpa('R290', 22)), unit: 'kPa' },
      ],
    })
    expect(top(r, 1), JSON.stringify(top(r, 4))).toEqual(['wrong-refrigerant@single'])
    expect(r.derived.single?.bestFitRefrigerant).toBe('R290')
    expect(r.causes[0]?.evidence.map((e) => e.text).join(' ')).toMatch(/off the R134a curve, while R290 fits/)
  })

  it('a running evaporator colder than the nameplate saturation temperature, on another curve, raises wrong-refrigerant (common practice, no source)', async () => {
    // Nameplate R134a; suction pressure and evaporator temperature lie on the R404A curve at −30 °C.
    const r = await rank({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R134a' }], design: { cabinetC: -20 } },
      symptoms: ['slow-pulldown', 'recently-serviced'],
      readings: [
        { quantity: 'compressorRunning', stage: 'single', value: true, unit: 'bool' },
        { quantity: 'suctionPressure', stage: 'single', value: Math.round(satKpa('R404A', -30)), unit: 'kPa' },
        { quantity: 'evaporatorTemperature', stage: 'single', value: -30, unit: 'C' },
      ],
    })
    expect(top(r, 1), JSON.stringify(top(r, 4))).toEqual(['wrong-refrigerant@single'])
  })
})
