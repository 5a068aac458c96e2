import { describe, expect, it } from 'vitest'
import { chargeFromStandingPressure, standingPressureFromCharge } from '#shared/utils/properties'
import { rechargePreview, type RechargeForm } from '~/utils/rechargePreview'

const PSI_KPA = 6.894757293168361 // 1 psi = 6.894 757 kPa (NIST SP 811)
const SEA_LEVEL = 101.325 // ISO 2533 standard atmosphere at 0 m
const low = { refrigerant: 'R170', chargeG: 90, volumeL: 7.5, designPressureKpa: null }
const form: RechargeForm = { method: 'standing-pressure', grams: '', startGrams: '', targetGrams: '', pressure: '40', pressureUnit: 'psig', ambientC: '22', cylinder: '' }

describe('rechargePreview', () => {
  it('by standing pressure: grams now, to go and share of the nameplate target, as the server judges the step', () => {
    const v = rechargePreview(low, form, SEA_LEVEL)
    if (v.state !== 'ok') throw new Error(v.state)
    // By hand: 40 psig = 40 × 6.894757 + 101.325 = 377.115 kPa abs; the grams at that pressure from the ethane EOS (Bücker & Wagner 2006).
    const inStage = chargeFromStandingPressure({ designation: 'R170', ambientC: 22, volumeL: 7.5, pressureKpa: 40 * PSI_KPA + SEA_LEVEL }).chargeG
    expect(v.progress.chargeNowG).toBeCloseTo(inStage, 6)
    expect(v.progress.toGoG).toBeCloseTo(90 - inStage, 6)
    expect(v.progress.percentOfTarget).toBeCloseTo((inStage / 90) * 100, 6)
    expect(v.targetG).toBe(90)
    // The pressure to charge to is where the 90 g target stands at 22 °C, in the gauge unit typed.
    const target = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 7.5, chargeG: 90 })
    expect(v.progress.target.reading!.text).toBe(`${((target.pressureKpa - SEA_LEVEL) / PSI_KPA).toFixed(1)} psig`)
  })

  it('by weight: the standing pressure to expect for the grams in the stage (round trip), against a typed target', () => {
    const v = rechargePreview(low, { ...form, method: 'scale', grams: '45', startGrams: '30', targetGrams: '100' }, SEA_LEVEL)
    if (v.state !== 'ok') throw new Error(v.state)
    const expected = standingPressureFromCharge({ designation: 'R170', ambientC: 22, volumeL: 7.5, chargeG: 75 })
    expect(v.progress.standingPressureKpa).toBeCloseTo(expected.pressureKpa, 6)
    expect(v.progress.chargeNowG).toBe(75)
    expect(v.progress.toGoG).toBe(25)
    expect(v.progress.percentOfTarget).toBe(75)
  })

  it('checks against the stage design pressure', () => {
    // 90 g of ethane in 7.5 L at 22 °C stands near 0.9 MPa abs (Bücker & Wagner 2006 EOS): over a 700 kPa abs design pressure.
    const v = rechargePreview({ ...low, designPressureKpa: 700 }, { ...form, method: 'scale', grams: '90' }, SEA_LEVEL)
    expect(v.state === 'ok' && v.progress.warnings[0]).toMatch(/^DANGER/)
  })

  it('says what is missing, and a bad pressure in words, never NaN', () => {
    expect(rechargePreview({ ...low, volumeL: null }, form, SEA_LEVEL)).toMatchObject({ state: 'waiting', needs: expect.stringMatching(/internal volume/) })
    expect(rechargePreview({ ...low, chargeG: null }, form, SEA_LEVEL)).toMatchObject({ state: 'waiting', needs: expect.stringMatching(/should hold/) })
    expect(rechargePreview(low, { ...form, ambientC: '' }, SEA_LEVEL)).toMatchObject({ state: 'waiting', needs: expect.stringMatching(/room temperature/) })
    expect(rechargePreview(low, { ...form, pressure: 'lots' }, SEA_LEVEL)).toMatchObject({ state: 'waiting' })
    expect(rechargePreview(low, { ...form, pressure: '-20' }, SEA_LEVEL)).toMatchObject({ state: 'problem', message: expect.stringMatching(/vacuum/) })
    expect(rechargePreview(low, { ...form, ambientC: '900' }, SEA_LEVEL)).toMatchObject({ state: 'problem' })
    expect(rechargePreview({ ...low, refrigerant: 'R9999' }, form, SEA_LEVEL)).toMatchObject({ state: 'waiting', needs: expect.stringMatching(/no data/) })
  })
})
