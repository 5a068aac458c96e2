import { describe, expect, it } from 'vitest'
import type { RankRequest } from '#shared/types/diagnosis'
import { saturationPressure, saturationTemperature, standingPressureFromCharge } from '#shared/utils/properties'
import { deriveFacts } from '#server/domain/diagnosis/facts'
import { FACT_SPECS } from '#server/domain/diagnosis/fact-vocabulary'
import { satKpa } from './scenario-helpers'
import { buildScenario } from '#server/domain/diagnosis/scenarios/builder'
import { healthy, withState } from '#server/domain/diagnosis/scenarios/baselines'

const freezer = (state = healthy('freezerR290', 25)) => buildScenario({ id: 'x', title: 'x', source: 'x', unit: 'freezerR290', expected: { cause: 'other' }, state }).request

describe('deriveFacts: readings', () => {
  it('normalises gauge units to kPa absolute and °F to °C (unit definitions: common practice, no source)', () => {
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

  it('keeps repair and verification readings out and says so in words', () => {
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] },
      readings: [
        { quantity: 'standingPressure', stage: 'single', value: 9, unit: 'barg', phase: 'repair' },
        { quantity: 'cabinetTemperature', value: -20, unit: 'C', phase: 'verification' },
        { quantity: 'ambientTemperature', value: 21, unit: 'C' },
      ],
    })
    expect(r.facts['single.standingPressureKpa']).toBeUndefined()
    expect(r.facts.cabinetC).toBeUndefined()
    expect(r.facts.ambientC).toBe(21)
    expect(r.setAside).toEqual([
      'System standing pressure 9 barg, taken during the repair, is kept in the record but does not move the diagnosis.',
      'Cabinet temperature -20 C, taken to verify the repair, is kept in the record but does not move the diagnosis.',
    ])
  })
})

describe('deriveFacts: a healthy single-stage freezer', () => {
  const { facts, derived } = deriveFacts(freezer())

  it('derives saturated temperatures, superheat, subcooling and ratio', () => {
    expect(facts['single.saturatedSuctionC']).toBeCloseTo(-30, 0)
    expect(facts['single.saturatedCondensingC']).toBeCloseTo(40, 0)
    expect(facts['single.superheatK']).toBeCloseTo(7, 0)
    expect(facts['single.subcoolingK']).toBeCloseTo(4, 0)
    expect(facts['single.compressionRatio']).toBeCloseTo(satKpa('R290', 40) / satKpa('R290', -30), 1)
    expect(facts['single.dischargeSuperheatK']).toBeCloseTo(45, 0)
    // 85 % of 5 A read to 0.1 A on the clamp meter.
    expect(Math.abs((facts['single.currentPercentOfRated'] as number) - 85)).toBeLessThan(1.5)
    expect(derived.single?.running).toBe(true)
  })

  it('puts residuals on the healthy expectation: cabinet target −10 K, condenser air +15 K (common practice, no source)', () => {
    expect(facts['single.evaporatingResidualK']).toBeCloseTo(0, 0)
    expect(facts['single.condensingResidualK']).toBeCloseTo(0, 0)
    expect(facts.condenserAirRiseK).toBe(8)
    expect(facts.cabinetVsEvaporatingK).toBeCloseTo(0, 0)
  })

  it('gives each residual a standard uncertainty from the digits typed and the instrument', () => {
    // Suction entered to 1 kPa (σ = 1/√12) with a 1 % gauge: about 1.2 kPa; R290 at −30 °C moves about 0.1 K per kPa.
    const u = facts['single.evaporatingUncertaintyK'] as number
    expect(u).toBeGreaterThan(0.05)
    expect(u).toBeLessThan(0.5)
    expect(facts['single.superheatUncertaintyK'] as number).toBeGreaterThan(0.5)
  })

  it('only emits facts of the vocabulary', () => {
    for (const name of Object.keys(facts)) expect(FACT_SPECS.has(name), name).toBe(true)
  })
})

describe('deriveFacts: standing pressure', () => {
  const cascade = (standingKpa: number, ambient = 21): RankRequest => ({
    unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R290' }, { stage: 'low', refrigerant: 'R1150', chargeG: 250, volumeL: 9.5 }], design: { cabinetC: -80, cascadeHxC: -35 } },
    readings: [
      { quantity: 'ambientTemperature', value: ambient, unit: 'C' },
      { quantity: 'standingPressure', stage: 'low', value: standingKpa, unit: 'kPa' },
    ],
  })
  const expected = standingPressureFromCharge({ designation: 'R1150', ambientC: 21, volumeL: 9.5, chargeG: 250 }).pressureKpa

  it('compares the low stage with the value its charge gives at the room temperature (Smukala et al. 2000 EOS)', () => {
    const { facts, derived } = deriveFacts(cascade(expected / 2))
    expect(facts['low.expectedStandingPressureKpa']).toBeCloseTo(expected, 6)
    expect(facts['low.standingResidualPct']).toBeCloseTo(-50, 3)
    expect(facts['low.standingPhase']).toBe('supercritical')
    // Supercritical gas: pressure is not proportional to mass, so half the pressure is less than half the charge.
    expect(facts['low.standingChargePercent']).toBeGreaterThan(40)
    expect(facts['low.standingChargePercent']).toBeLessThan(50)
    expect(derived.low?.standingPercentOfExpected).toBe(50)
    // A 1.5 K difference between the stage and the room moves the isochore by under 1 %.
    expect(facts['low.standingUncertaintyPct'] as number).toBeLessThan(2)
  })

  it('shifts a reference standing pressure isochorically to today’s room, preferring it over charge and volume', () => {
    const ref = standingPressureFromCharge({ designation: 'R1150', ambientC: 18, volumeL: 9.5, chargeG: 250 }).pressureKpa
    const req = cascade(1000)
    req.unit.stages[1] = { stage: 'low', refrigerant: 'R1150', referenceStandingPressureKpa: ref, referenceAmbientC: 18 }
    expect(deriveFacts(req).facts['low.expectedStandingPressureKpa']).toBeCloseTo(expected, -1)
  })

  it('does not call a stage stopped for its standing pressure "stopped while called"', () => {
    const req = cascade(expected)
    req.readings!.push({ quantity: 'compressorRunning', stage: 'low', value: false, unit: 'bool' }, { quantity: 'cabinetTemperature', value: -40, unit: 'C' })
    expect(deriveFacts(req).facts['low.stoppedWhileCalled']).toBe(false)
  })
})

describe('deriveFacts: refrigerant that fits', () => {
  it('finds the refrigerant that fits a two-phase standing pair and works the stage out with it', () => {
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R134a' }] },
      readings: [
        { quantity: 'ambientTemperature', value: 22, unit: 'C' },
        { quantity: 'standingPressure', stage: 'single', value: Math.round(satKpa('R290', 22)), unit: 'kPa' },
        { quantity: 'suctionPressure', stage: 'single', value: Math.round(satKpa('R290', -25)), unit: 'kPa' },
      ],
    })
    const r134aAtP = saturationTemperature('R134a', Math.round(satKpa('R290', 22))).dewC
    expect(r.facts['single.refrigerantOffsetK']).toBeCloseTo(22 - r134aAtP, 1)
    expect(r.facts['single.bestFitRefrigerant']).toBe('R290')
    expect(r.facts['single.refrigerantMismatch']).toBe(true)
    expect(r.facts['single.workingRefrigerant']).toBe('R290')
    expect(r.facts['single.saturatedSuctionC']).toBeCloseTo(-25, 0)
    expect(r.warnings.join('\n')).toMatch(/fits R290, not the nameplate R134a .* worked out for R290/)
  })

  it('names the nameplate refrigerant as the best fit when its own curve fits the pair, although a near-azeotrope lies close by', () => {
    // R404A and R507A bubble curves lie within about a kelvin of each other (both near-azeotropic blends of R125 and R143a).
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R404A' }] },
      readings: [
        { quantity: 'ambientTemperature', value: 22, unit: 'C' },
        { quantity: 'standingPressure', stage: 'single', value: Math.round(saturationPressure('R404A', 22).bubbleKpa), unit: 'kPa' },
      ],
    })
    expect(r.facts['single.bestFitRefrigerant']).toBe('R404A')
    expect(r.facts['single.refrigerantMismatch']).toBe(false)
    expect(r.facts['single.workingRefrigerant']).toBe('R404A')
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
    expect(facts['single.workingRefrigerant']).toBe('R404A')
  })
})

describe('deriveFacts: running state and contradictions', () => {
  it('reads 0 A as stopped even when reported running, and counts a cabinet calling for cold', () => {
    const state = withState(healthy('freezerR290', 25), { cabinet: 0, single: { running: true, currentPct: 0, sst: undefined, sct: undefined } })
    const r = deriveFacts(freezer(state))
    expect(r.facts['single.running']).toBe(false)
    expect(r.facts['single.stoppedWhileCalled']).toBe(true)
    expect(r.warnings.join('\n')).toMatch(/reported running, but the compressor draws 0\.0 A, so it is not running/)
  })

  it('keeps a compressor that visibly pumps running, and drops the 0 A clamp reading', () => {
    const state = withState(healthy('freezerR290', 25), { single: { currentPct: 0 } })
    const r = deriveFacts(freezer(state))
    expect(r.facts['single.running']).toBe(true)
    expect(r.facts['single.compressorCurrentA']).toBeUndefined()
    expect(r.warnings.join('\n')).toMatch(/clamp is round one conductor/)
  })

  it('takes a compressor reported stopped and drawing 0 A as stopped, though its gauges are still apart (common practice, no source)', () => {
    // Minutes after a trip, or on a stage whose valve closes at standstill, suction and discharge stay apart.
    const state = withState(healthy('freezerR290', 25), { single: { running: false, currentPct: 0 } })
    const r = deriveFacts(freezer(state))
    expect(r.facts['single.running']).toBe(false)
    expect(r.facts['single.compressorCurrentA']).toBe(0)
    expect(r.warnings.join('\n')).not.toMatch(/clamp/)
  })

  it('warns in words on suction above discharge, and leaves both pressures out', () => {
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R290' }] },
      readings: [
        { quantity: 'suctionPressure', stage: 'single', value: 900, unit: 'kPa' },
        { quantity: 'dischargePressure', stage: 'single', value: 300, unit: 'kPa' },
        { quantity: 'compressorRunning', stage: 'single', value: true, unit: 'bool' },
        { quantity: 'standingPressure', stage: 'single', value: 800, unit: 'kPa' },
      ],
    })
    expect(r.warnings.join('\n')).toMatch(/suction pressure is not below the discharge pressure/)
    expect(r.warnings.join('\n')).toMatch(/needs the room temperature beside it/)
    expect(r.facts['single.compressionRatio']).toBeUndefined()
  })

  it('turns an out-of-range property call into a missing fact plus a warning in words', () => {
    // R1150 has no saturation above its 9.2 °C critical point: 6 MPa suction is out of range.
    const r = deriveFacts({
      unit: { kind: 'cascade', stages: [{ stage: 'high', refrigerant: 'R290' }, { stage: 'low', refrigerant: 'R1150' }] },
      readings: [{ quantity: 'suctionPressure', stage: 'low', value: 6000, unit: 'kPa' }],
    })
    expect(r.facts['low.suctionPressureKpa']).toBe(6000)
    expect(r.facts['low.saturatedSuctionC']).toBeUndefined()
    expect(r.warnings.join('\n')).toMatch(/^Low stage suction pressure: R1150 saturation is defined from .* The value is not worked out\.$/m)
  })

  it('names an unknown refrigerant and a reading below vacuum without fact names', () => {
    const r = deriveFacts({
      unit: { kind: 'single-stage', stages: [{ stage: 'single', refrigerant: 'R9999' }] },
      readings: [{ quantity: 'suctionPressure', stage: 'single', value: -120, unit: 'kPag' }],
    })
    const text = r.warnings.join('\n')
    expect(text).toMatch(/no property tables for R9999/)
    expect(text).toMatch(/System suction pressure: -120 kPag is below a perfect vacuum/)
    expect(text).not.toMatch(/single\.|single:|Kpa\b/)
  })
})
