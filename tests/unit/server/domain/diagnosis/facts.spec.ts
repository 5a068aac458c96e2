import { describe, expect, it } from 'vitest'
import type { RankRequest } from '#shared/types/diagnosis'
import { saturationPressure, saturationTemperature } from '#shared/utils/properties'
import { deriveFacts } from '#server/domain/diagnosis/facts'
import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'
import { cascadeFreezer, expectedLowStanding, satKpa, singleStageFreezer } from './scenario-helpers'

describe('deriveFacts', () => {
  it('normalises gauge units to kPa absolute and °F to °C (units: common practice, no source)', () => {
    const { facts } = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] },
      readings: [
        { quantity: 'suctionPressure', stage: 'single', value: 15, unit: 'psig' },
        { quantity: 'dischargePressure', stage: 'single', value: 1.2, unit: 'MPa' },
        { quantity: 'ambientTemperature', value: 77, unit: 'F' },
        { quantity: 'runtime', value: 30, unit: 'min' },
      ],
    })
    expect(facts['single.suctionPressureKpa']).toBeCloseTo(15 * 6.894757 + 101.325, 1)
    expect(facts['single.dischargePressureKpa']).toBeCloseTo(1200, 6)
    expect(facts.ambientC).toBeCloseTo(25, 6)
    expect(facts.runtimeMin).toBe(30)
  })

  it('turns gauge readings into absolute ones with the site altitude (ISO 2533 standard atmosphere)', () => {
    const request: RankRequest = {
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] },
      site: { altitudeM: 1500 },
      readings: [{ quantity: 'suctionPressure', stage: 'single', value: 100, unit: 'kPag' }],
    }
    // ISO 2533: 84.56 kPa at 1500 m.
    expect(deriveFacts(request).facts['single.suctionPressureKpa']).toBeCloseTo(184.56, 1)
    expect(deriveFacts({ ...request, site: { atmosphericKpa: 95 } }).facts['single.suctionPressureKpa']).toBeCloseTo(195, 6)
    expect(deriveFacts({ ...request, site: undefined }).facts['single.suctionPressureKpa']).toBeCloseTo(201.325, 6)
  })

  it('derives saturated temperatures, superheat, subcooling and ratio from a healthy freezer', () => {
    const { facts } = deriveFacts(singleStageFreezer({ sstC: -30, sctC: 40, superheatK: 6, subcoolingK: 5, currentPct: 100, airOutC: 33, cabinetC: -20 }))
    expect(facts['single.saturatedSuctionC']).toBeCloseTo(-30, 0)
    expect(facts['single.saturatedCondensingC']).toBeCloseTo(40, 0)
    expect(facts['single.superheatK']).toBeCloseTo(6, 0)
    expect(facts['single.subcoolingK']).toBeCloseTo(5, 0)
    expect(facts['single.compressionRatio']).toBeCloseTo(satKpa('R290', 40) / satKpa('R290', -30), 1)
    // Healthy = on the expectation: cabinet target −20 °C − 10 K, air 25 °C + 15 K (common practice, no source).
    expect(facts['single.suctionSatVsExpectedK']).toBeCloseTo(0, 0)
    expect(facts['single.condensingVsExpectedK']).toBeCloseTo(0, 0)
    expect(facts['single.compressionRatioVsExpected']).toBeCloseTo(1, 1)
    expect(facts['single.currentPercentOfRated']).toBeCloseTo(100, 6)
    expect(facts.condenserAirDeltaK).toBe(8)
    expect(facts['single.dischargeSuperheatK']).toBeCloseTo(45, 0)
  })

  it('compares the low-stage standing pressure with the value the charge gives at the measured ambient', () => {
    const expected = expectedLowStanding(21)
    const { facts, derived } = deriveFacts(cascadeFreezer({ cabinetC: -45, cascadeHxC: -36, lowStandingKpa: expected / 2 }))
    expect(facts['low.expectedStandingPressureKpa']).toBeCloseTo(expected, 6)
    expect(facts['low.standingRatio']).toBeCloseTo(0.5, 3)
    expect(facts['low.standingPhase']).toBe('supercritical')
    // Supercritical gas: pressure is not proportional to mass, so the charge estimate is not exactly 50 % (from memory: Z rises as density falls).
    expect(facts['low.standingChargePercent']).toBeGreaterThan(40)
    expect(facts['low.standingChargePercent']).toBeLessThan(50)
    expect(derived.low?.standingPercentOfExpected).toBe(50)
    expect(facts.cascadeHxAboveDesignK).toBe(-1)
    expect(facts.cabinetAboveTargetK).toBe(35)
  })

  it('shifts a reference standing pressure isochorically to today’s ambient, preferring it over charge/volume', () => {
    const ref = expectedLowStanding(18)
    const req: RankRequest = cascadeFreezer({ cabinetC: -80, cascadeHxC: -35, lowStandingKpa: 1000 })
    req.unit.stages[1] = { stage: 'low', refrigerant: 'R1150', referenceStandingPressureKpa: ref, referenceAmbientC: 18 }
    const { facts } = deriveFacts(req)
    expect(facts['low.expectedStandingPressureKpa']).toBeCloseTo(expectedLowStanding(21), -1)
  })

  it('finds the refrigerant that fits a two-phase standing pair', () => {
    const { facts } = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R134a' }] },
      readings: [
        { quantity: 'ambientTemperature', value: 22, unit: 'C' },
        { quantity: 'standingPressure', stage: 'single', value: satKpa('R290', 22), unit: 'kPa' },
      ],
    })
    const r134aAtP = saturationTemperature('R134a', satKpa('R290', 22)).dewC
    expect(facts['single.refrigerantOffsetK']).toBeCloseTo(22 - r134aAtP, 1)
    expect(facts['single.bestFitRefrigerant']).toBe('R290')
    expect(facts['single.refrigerantMismatch']).toBe(true)
  })

  it('leaves the pair alone when the nameplate refrigerant fits', () => {
    const { facts } = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R404A' }] },
      readings: [
        { quantity: 'ambientTemperature', value: 20, unit: 'C' },
        { quantity: 'standingPressure', stage: 'single', value: saturationPressure('R404A', 20).dewKpa, unit: 'kPa' },
      ],
    })
    expect(facts['single.refrigerantFitK']).toBeLessThan(0.5)
    expect(facts['single.refrigerantMismatch']).toBe(false)
  })

  it('turns symptoms into booleans and only emits facts of the vocabulary', () => {
    const { facts } = deriveFacts(cascadeFreezer({ cabinetC: -45, cascadeHxC: -36, symptoms: ['oil-at-fitting'] }))
    expect(facts['symptom.oil-at-fitting']).toBe(true)
    expect(facts['symptom.not-cooling']).toBe(false)
    for (const name of Object.keys(facts)) expect(FACT_SPECS.has(name), name).toBe(true)
  })
})

describe('data quality never throws', () => {
  it('warns on suction above discharge, running at 0 A, standing pressure without ambient', () => {
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] },
      readings: [
        { quantity: 'suctionPressure', stage: 'single', value: 900, unit: 'kPa' },
        { quantity: 'dischargePressure', stage: 'single', value: 300, unit: 'kPa' },
        { quantity: 'compressorRunning', stage: 'single', value: true, unit: 'bool' },
        { quantity: 'compressorCurrent', stage: 'single', value: 0, unit: 'A' },
        { quantity: 'standingPressure', stage: 'single', value: 800, unit: 'kPa' },
      ],
    })
    expect(r.warnings.join('\n')).toMatch(/suction pressure is not below discharge/)
    expect(r.warnings.join('\n')).toMatch(/running but drawing about 0 A/)
    expect(r.warnings.join('\n')).toMatch(/standing pressure given without ambientTemperature/)
    expect(r.facts['single.compressionRatio']).toBeUndefined()
  })

  it('turns an out-of-range property call into a missing fact plus a warning', () => {
    // R1150 has no saturation above its 9.2 °C critical point: 6 MPa suction is out of range.
    const r = deriveFacts({
      unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R290' }, { stage: 'low', refrigerant: 'R1150' }] },
      readings: [{ quantity: 'suctionPressure', stage: 'low', value: 6000, unit: 'kPa' }],
    })
    expect(r.facts['low.suctionPressureKpa']).toBe(6000)
    expect(r.facts['low.saturatedSuctionC']).toBeUndefined()
    expect(r.warnings.join('\n')).toMatch(/low saturated suction: not derived/)
  })

  it('warns about an unknown refrigerant and a reading below vacuum', () => {
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R9999' }] },
      readings: [{ quantity: 'suctionPressure', stage: 'single', value: -120, unit: 'kPag' }],
    })
    expect(r.warnings.join('\n')).toMatch(/R9999/)
    expect(r.warnings.join('\n')).toMatch(/single:suctionPressure: not derived|below absolute zero pressure/)
  })
})
