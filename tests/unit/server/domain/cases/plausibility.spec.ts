import { describe, expect, it } from 'vitest'
import { checkReadings } from '#server/domain/cases/plausibility'
import type { UnitDto } from '#shared/types/equipment-dto'

const stages: UnitDto['stages'] = [
  { stage: 'high', refrigerant: 'R404A', chargeG: 400, volumeL: 8, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 6 },
  { stage: 'low', refrigerant: 'R1150', chargeG: 90, volumeL: 7.5, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: null },
]
const unit = { stages }
const SEA_LEVEL = 101.325 // ISO 2533 standard atmosphere at 0 m

describe('plausibility of readings', () => {
  it('refuses a temperature below absolute zero (0 K = −273.15 °C, SI brochure definition of the kelvin)', () => {
    const verdict = checkReadings(unit, [{ quantity: 'cabinetTemperature', value: -300, unit: 'C' }, { quantity: 'ambientTemperature', value: -460, unit: 'F' }], SEA_LEVEL)
    expect(Object.keys(verdict.impossible)).toEqual(['readings.0.value', 'readings.1.value'])
    expect(verdict.impossible['readings.0.value']![0]).toMatch(/below absolute zero/)
    // −459.67 °F is absolute zero (definition of the Rankine scale): −459 °F is possible.
    expect(checkReadings(unit, [{ quantity: 'ambientTemperature', value: -459, unit: 'F' }], SEA_LEVEL).impossible).toEqual({})
  })

  it('refuses an absolute pressure below zero: −200 psig is far below a perfect vacuum (1 psi = 6.894757 kPa, NIST SP 811)', () => {
    const verdict = checkReadings(unit, [{ quantity: 'suctionPressure', stage: 'low', value: -200, unit: 'psig' }], SEA_LEVEL)
    expect(verdict.impossible['readings.0.value']![0]).toMatch(/below a perfect vacuum/)
    // −14.6 psig is 0.66 kPa absolute at sea level: a deep vacuum, possible on a suction line.
    expect(checkReadings(unit, [{ quantity: 'suctionPressure', stage: 'low', value: -14.6, unit: 'psig' }], SEA_LEVEL).impossible).toEqual({})
  })

  it('refuses a refrigerant state outside its equation of state: 99 999 psig of ethylene is above the 300 MPa limit of Smukala et al. 2000', () => {
    const verdict = checkReadings(unit, [{ quantity: 'dischargePressure', stage: 'low', value: 99_999, unit: 'psig' }], SEA_LEVEL)
    expect(verdict.impossible['readings.0.value']![0]).toMatch(/equation of state/)
    // Ethylene's triple point is 103.989 K = −169.16 °C (Smukala et al. 2000): a liquid line colder than that is frozen ethylene.
    expect(checkReadings(unit, [{ quantity: 'liquidLineTemperature', stage: 'low', value: -175, unit: 'C' }], SEA_LEVEL).impossible['readings.0.value']).toBeDefined()
  })

  it('asks to confirm readings far outside the design envelope and stops asking once confirmed (limits: common practice, no source)', () => {
    const readings = [
      { quantity: 'cabinetTemperature' as const, value: -200, unit: 'C' as const },
      // R404A critical pressure 3735 kPa (Lemmon 2003 pseudo-pure EOS); 600 psig is 4238 kPa absolute.
      { quantity: 'dischargePressure' as const, stage: 'high' as const, value: 600, unit: 'psig' as const },
      // Rated 6 A: 25 A is above three times the rating.
      { quantity: 'compressorCurrent' as const, stage: 'high' as const, value: 25, unit: 'A' as const },
      { quantity: 'cabinetTemperature' as const, value: -80, unit: 'C' as const },
    ]
    const verdict = checkReadings(unit, readings, SEA_LEVEL)
    expect(verdict.impossible).toEqual({})
    expect(verdict.outsideEnvelope.map((q) => q.index)).toEqual([0, 1, 2])
    expect(verdict.outsideEnvelope[1]!.message).toMatch(/critical pressure of R404A/)
    expect(checkReadings(unit, readings, SEA_LEVEL, new Set([0, 1, 2])).outsideEnvelope).toEqual([])
  })

  it('judges a pressure above the stage design pressure when the nameplate gives one', () => {
    const withDesign = { stages: stages.map((s) => (s.stage === 'high' ? { ...s, designPressureKpa: 2500 } : s)) }
    // 350 psig = 2514.5 kPa absolute at sea level: within 10 % of 2500 kPa, no question; 400 psig = 2859 kPa is above it.
    expect(checkReadings(withDesign, [{ quantity: 'dischargePressure', stage: 'high', value: 350, unit: 'psig' }], SEA_LEVEL).outsideEnvelope).toEqual([])
    expect(checkReadings(withDesign, [{ quantity: 'dischargePressure', stage: 'high', value: 400, unit: 'psig' }], SEA_LEVEL).outsideEnvelope[0]!.message).toMatch(/design pressure/)
  })

  describe('pressures no refrigeration stage can hold (ceiling: common practice, no source)', () => {
    const ethane = { stages: stages.map((s) => (s.stage === 'low' ? { ...s, refrigerant: 'R170' } : s)) }

    it('refuses 99 999 psig on an R170 stage although ethane\'s equation of state reaches 900 MPa (Bücker & Wagner 2006)', () => {
      // 99 999 psig = 689 570 kPa absolute at sea level (1 psi = 6.894757 kPa, NIST SP 811): inside the EOS range.
      const verdict = checkReadings(ethane, [{ quantity: 'dischargePressure', stage: 'low', value: 99_999, unit: 'psig' }], SEA_LEVEL)
      expect(verdict.impossible['readings.0.value']![0]).toMatch(/more than any refrigeration stage is built to hold/)
      expect(verdict.outsideEnvelope).toEqual([])
      // 3000 psig = 20 786 kPa absolute: just above the 20 MPa ceiling; 2800 psig = 19 407 kPa is below it.
      expect(checkReadings(ethane, [{ quantity: 'standingPressure', stage: 'low', value: 3000, unit: 'psig' }], SEA_LEVEL).impossible['readings.0.value']).toBeDefined()
      expect(checkReadings(ethane, [{ quantity: 'standingPressure', stage: 'low', value: 2800, unit: 'psig' }], SEA_LEVEL).impossible).toEqual({})
    })

    it('keeps a merely far-outside pressure as a question: 800 psig of ethane is above its critical pressure of 4872 kPa (Bücker & Wagner 2006)', () => {
      // 800 psig = 5617 kPa absolute at sea level.
      const verdict = checkReadings(ethane, [{ quantity: 'dischargePressure', stage: 'low', value: 800, unit: 'psig' }], SEA_LEVEL)
      expect(verdict.impossible).toEqual({})
      expect(verdict.outsideEnvelope[0]!.message).toMatch(/critical pressure of R170/)
    })

    it('with a nameplate design pressure, refuses above five times it and asks between 1.1 and 5 times it', () => {
      const withDesign = { stages: ethane.stages.map((s) => (s.stage === 'low' ? { ...s, designPressureKpa: 1500 } : s)) }
      // 5 × 1500 kPa = 7500 kPa. 1100 psig = 7686 kPa absolute: refused; 1000 psig = 6996 kPa: asked.
      const refused = checkReadings(withDesign, [{ quantity: 'suctionPressure', stage: 'low', value: 1100, unit: 'psig' }], SEA_LEVEL)
      expect(refused.impossible['readings.0.value']![0]).toMatch(/5 times the stage's design pressure/)
      const asked = checkReadings(withDesign, [{ quantity: 'suctionPressure', stage: 'low', value: 1000, unit: 'psig' }], SEA_LEVEL)
      expect(asked.impossible).toEqual({})
      expect(asked.outsideEnvelope[0]!.message).toMatch(/design pressure/)
    })

    it('applies the ceiling to a refrigerant the app has no equation of state for', () => {
      const unknown = { stages: stages.map((s) => (s.stage === 'high' ? { ...s, refrigerant: 'R9999X' } : s)) }
      expect(checkReadings(unknown, [{ quantity: 'dischargePressure', stage: 'high', value: 99_999, unit: 'psig' }], SEA_LEVEL).impossible['readings.0.value']).toBeDefined()
    })
  })
})
