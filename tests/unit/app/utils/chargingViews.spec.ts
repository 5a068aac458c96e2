import { describe, expect, it } from 'vitest'
import {
  chargingView, designPressureFields, nameplateStanding, planRecordBody, prefillFromQuery, substitutionView, type ChargingForm, type SubstitutionForm,
} from '~/utils/chargingViews'

// Figures: R13 (Platzer 1990) and R1150 (Smukala 2000) EOS as computed with CoolProp 8.0.0.
const sub: SubstitutionForm = {
  from: 'R13', chargeG: '600', volumeL: '12', ambientC: '22', to: 'R1150', basis: 'standing-pressure',
  evaporatingC: '−85', condensingC: '', designPressure: '', designUnit: 'barg', displayUnit: 'psig',
}

describe('substitutionView', () => {
  it('plans from typed text (decimal comma and typographic minus accepted)', () => {
    const v = substitutionView({ ...sub, volumeL: '12,0' }, 101.325)
    expect(v.errors).toEqual({})
    expect(v.result!.chargeG).toBeCloseTo(153.8, 1)
    expect(v.result!.chargeTo!.text).toBe('137.6 psig')
    expect(v.result!.plans[2]).toMatchObject({ available: true, chargeG: expect.closeTo(211.2, 1) })
  })

  it('waits for the nameplate charge, volume and ambient, and puts bad numbers beside their fields', () => {
    expect(substitutionView({ ...sub, chargeG: '' }, 101.325)).toEqual({ errors: {} })
    expect(substitutionView({ ...sub, volumeL: 'lots' }, 101.325).errors.volumeL).toMatch(/Type a number/)
    expect(substitutionView({ ...sub, volumeL: '0' }, 101.325).errors.volumeL).toMatch(/above 0 L/)
    expect(substitutionView({ ...sub, basis: 'liquid-volume', evaporatingC: '' }, 101.325).errors.evaporatingC).toMatch(/evaporating temperature/)
  })

  it('converts a gauge design pressure with the local atmosphere and warns against it', () => {
    // 25 barg at sea level = 2601.3 kPa abs; the same-mass plan stands at 3363.8 kPa abs.
    const v = substitutionView({ ...sub, basis: 'mass', designPressure: '25' }, 101.325)
    expect(v.result!.designPressureKpa).toBeCloseTo(2601.325, 3)
    expect(v.result!.warnings[0]).toMatch(/^DANGER/)
    expect(substitutionView({ ...sub, designPressure: '-5' }, 101.325).errors.designPressure).toMatch(/perfect vacuum/)
  })

  it('shows a state outside the models as a problem in their words', () => {
    expect(substitutionView({ ...sub, ambientC: '900' }, 101.325).problem).toMatch(/defined from/)
    expect(substitutionView({ ...sub, basis: 'liquid-volume', evaporatingC: '15' }, 101.325).problem).toMatch(/9\.2 °C/)
  })
})

const charging: ChargingForm = { designation: 'R1150', targetG: '153.8', volumeL: '12', ambientC: '22', by: 'pressure', pressure: '100', pressureUnit: 'psig', addedG: '', startG: '' }

describe('chargingView', () => {
  it('from a gauge reading: 100 psig is 113.9 g, 74.1 % of the target', () => {
    const v = chargingView(charging, 101.325)
    expect(v.result!.chargeNowG).toBeCloseTo(113.9, 1)
    expect(v.result!.percentOfTarget).toBeCloseTo(74.06, 1)
  })

  it('reads the same gauge figure against a thinner atmosphere at altitude: less gas', () => {
    expect(chargingView(charging, 79.495).result!.chargeNowG).toBeLessThan(113.9)
  })

  it('from grams weighed in, and field errors beside the inputs', () => {
    const w = chargingView({ ...charging, by: 'weight', addedG: '120', startG: '' }, 101.325)
    expect(w.result!.chargeNowG).toBe(120)
    expect(chargingView({ ...charging, targetG: '0' }, 101.325).errors.targetG).toMatch(/above 0 g/)
    expect(chargingView({ ...charging, pressure: '-20' }, 101.325).problem).toMatch(/perfect vacuum/)
  })
})

describe('design pressure from the stage', () => {
  it('a stage with a design pressure fills the planner in kPa abs; one without leaves the field alone', () => {
    expect(designPressureFields({ designPressureKpa: 2601.33 })).toEqual({ designPressure: '2601.3', designUnit: 'kPa' })
    expect(designPressureFields({ designPressureKpa: null })).toEqual({})
  })

  it('the charging card warns against the stage design pressure it was given', () => {
    // 100 psig at sea level = 790.8 kPa abs (1 psi = 6.894757 kPa, NIST SP 811); the near/over limits are common practice, no source.
    expect(chargingView({ ...charging, designPressureKpa: 700 }, 101.325).result!.warnings.join(' ')).toMatch(/^DANGER: at 22\.0 °C this stands at/)
    expect(chargingView({ ...charging, designPressureKpa: 820 }, 101.325).result!.warnings.join(' ')).toMatch(/Close to the design pressure/)
    expect(chargingView({ ...charging, designPressureKpa: 5000 }, 101.325).result!.warnings.join(' ')).not.toMatch(/design pressure/)
  })
})

describe('prefillFromQuery', () => {
  it('takes the room temperature and gauge unit a case sends, and drops anything malformed', () => {
    expect(prefillFromQuery({ ambientC: '21.5', gauge: 'psig' })).toEqual({ ambientC: '21.5', unit: 'psig' })
    expect(prefillFromQuery({ ambientC: 'warm', gauge: 'inches' })).toEqual({})
    expect(prefillFromQuery({ ambientC: '400' })).toEqual({})
    expect(prefillFromQuery({ ambientC: ['20', '21'] })).toEqual({})
  })
})

describe('planRecordBody', () => {
  it("keeps the chosen plan as the stage's new fill, its figures in words in the note", () => {
    const plan = substitutionView(sub, 101.325).result!
    const body = planRecordBody(plan, { unitId: 4, unitName: 'Freezer F-204', stage: 'low', caseId: 9 }, '  cylinder 17 ')
    // 153.8 g and 137.6 psig: R13 (Platzer 1990) and R1150 (Smukala 2000) EOS via CoolProp 8.0.0, sea-level gauge.
    expect(body).toMatchObject({ stage: 'low', refrigerant: 'R1150', chargeG: 153.8, basis: 'standing-pressure', caseId: 9 })
    expect(body.note).toMatch(/^Same standing pressure plan for 12 L: 154 g of R1150 for the nameplate 600 g of R13; charge to 137\.6 psig \(\d+\.\d kPa abs\) at 22\.0 °C room\. cylinder 17$/)
    expect(planRecordBody(plan, { unitId: 4, unitName: 'Freezer F-204', stage: 'low' }, '')).not.toHaveProperty('caseId')
    // The figures too, as the stage's new reference: 137.6 psig + 101.325 kPa = 1050.1 kPa abs (1 psi = 6.894757 kPa, NIST SP 811).
    expect(body.standingPressureKpa).toBeCloseTo(1050.1, 0)
    expect(body.ambientC).toBe(22)
  })

  it('a plan that is partly liquid at the ambient says to weigh it in', () => {
    // 600 g of R13 as 600 g of R170 in 1 L at 22 °C is far denser than its saturated vapour (two-phase).
    const plan = substitutionView({ ...sub, to: 'R170', volumeL: '1', basis: 'mass' }, 101.325).result!
    expect(plan.chargeTo).toBeNull()
    expect(planRecordBody(plan, { unitId: 4, unitName: 'F', stage: 'low' }, '').note).toMatch(/weigh it in/)
    // Its standing pressure is the saturation pressure whatever the charge: no reference to keep.
    expect(planRecordBody(plan, { unitId: 4, unitName: 'F', stage: 'low' }, '')).not.toHaveProperty('standingPressureKpa')
  })
})

describe('nameplateStanding', () => {
  it('the nameplate charge at the room temperature read, from the stage record; a partly liquid fill is not for the gauge', () => {
    // 300 g of ethane in 10 L at 20 °C: 1992.3 kPa abs, gas (Bücker & Wagner 2006 EOS via CoolProp 8.0.0).
    expect(nameplateStanding({ refrigerant: 'R170', chargeG: 300, volumeL: 10 }, 20)).toEqual({ pressureKpa: expect.closeTo(1992.3, 0), measurable: true })
    // 520 g of R404A in 6.2 L at 22 °C is far denser than its saturated vapour: two-phase, the pressure is the saturation pressure.
    expect(nameplateStanding({ refrigerant: 'R404A', chargeG: 520, volumeL: 6.2 }, 22)).toMatchObject({ measurable: false })
    expect(nameplateStanding({ refrigerant: 'R170', chargeG: null, volumeL: 10 }, 20)).toBeUndefined()
    expect(nameplateStanding({ refrigerant: 'R170', chargeG: 300, volumeL: 10 }, undefined)).toBeUndefined()
    expect(nameplateStanding({ refrigerant: 'R9999', chargeG: 300, volumeL: 10 }, 20)).toBeUndefined()
  })
})
