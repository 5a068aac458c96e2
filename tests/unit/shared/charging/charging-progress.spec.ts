import { describe, expect, it } from 'vitest'
import { chargingProgress, type ChargingInput } from '#shared/utils/charging'

// Ethylene (Smukala et al. 2000 EOS) and ethane (Bücker & Wagner 2006 EOS) values as computed with CoolProp 8.0.0.
const input: ChargingInput = { designation: 'R1150', volumeL: 12, ambientC: 22, targetChargeG: 153.8, display: { unit: 'psig', atmosphericKpa: 101.325 } }

describe('charging by standing pressure', () => {
  it('100 psig (790.8 kPa abs at sea level) of R1150 in 12 L at 22 °C is 113.9 g: 39.9 g to go, 74.1 % of 153.8 g', () => {
    const r = chargingProgress(input, { by: 'pressure', pressureKpa: 790.8 })
    expect(r.chargeNowG).toBeCloseTo(113.9, 1)
    expect(r.toGoG).toBeCloseTo(153.8 - 113.9, 1)
    expect(r.percentOfTarget).toBeCloseTo((113.9 / 153.8) * 100, 1)
    expect(r.chargeIsMinimum).toBe(false)
    expect(r.reading.text).toBe('100.0 psig')
    // Where the target stands: 153.8 g / 12 L = 12.817 kg/m³ of R1150 at 22 °C stands at 1049.6 kPa abs = 137.5 psig.
    expect(r.target.reading!.text).toBe('137.5 psig')
    expect(r.note).toMatch(/About 40 g to go/)
  })

  it('is not proportional: half the target pressure holds less than half the grams', () => {
    const r = chargingProgress(input, { by: 'pressure', pressureKpa: 1049.6 / 2 })
    expect(r.percentOfTarget).toBeLessThan(50)
  })

  it('by weight: 100 g weighed into an evacuated stage should read 830.99 kPa abs (10 kg/m³ of R1150 at 22 °C)', () => {
    const r = chargingProgress({ ...input, targetChargeG: 200 }, { by: 'weight', addedG: 100, startG: 20 })
    expect(r.chargeNowG).toBe(120)
    const weighed = chargingProgress({ ...input, targetChargeG: 200 }, { by: 'weight', addedG: 120, startG: 0 })
    expect(weighed.standingPressureKpa).toBeCloseTo(830.99, 0)
    expect(weighed.toGoG).toBe(80)
    expect(weighed.percentOfTarget).toBe(60)
  })

  it('round trip: the pressure expected from weighed grams gives the same grams back', () => {
    const w = chargingProgress(input, { by: 'weight', addedG: 87.5, startG: 0 })
    const p = chargingProgress(input, { by: 'pressure', pressureKpa: w.standingPressureKpa })
    expect(p.chargeNowG).toBeCloseTo(87.5, 6)
  })

  it('over the target: stop and recover', () => {
    const r = chargingProgress(input, { by: 'weight', addedG: 170, startG: 0 })
    expect(r.toGoG).toBeLessThan(0)
    expect(r.warnings.join(' ')).toMatch(/Over the target by 16 g/)
  })

  it('on target within 2 %: settle and re-read', () => {
    const r = chargingProgress(input, { by: 'weight', addedG: 153, startG: 0 })
    expect(r.note).toMatch(/On target/)
  })

  it('a target that is two-phase at ambient cannot be charged by pressure: charge by weight', () => {
    // 300 g of R170 in 1 L at 22 °C is between its saturated vapour and liquid densities.
    const r = chargingProgress({ ...input, designation: 'R170', volumeL: 1, targetChargeG: 300 }, { by: 'pressure', pressureKpa: 3940 })
    expect(r.target.reading).toBeNull()
    expect(r.chargeIsMinimum).toBe(true)
    expect(r.warnings.join(' ')).toMatch(/Charge it by weight/)
  })

  it('warns against the design pressure and gives the cautions of the charging step', () => {
    const r = chargingProgress({ ...input, designPressureKpa: 1000 }, { by: 'pressure', pressureKpa: 1049.6 })
    expect(r.warnings[0]).toMatch(/^DANGER/)
    expect(r.cautions.join(' ')).toMatch(/settled/)
    expect(r.cautions.join(' ')).toMatch(/flammable/)
    expect(r.cautions.join(' ')).not.toMatch(/ignite it|flame test/)
  })
})
