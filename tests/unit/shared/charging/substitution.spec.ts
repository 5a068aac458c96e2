import { describe, expect, it } from 'vitest'
import { planSubstitution, type SubstitutionInput, type SubstitutionPlan } from '#shared/utils/charging'
import { OutOfRangeError } from '#shared/utils/properties'

// Worked examples. Reference figures are CoolProp 8.0.0 with the fluids' reference equations of state
// (R13 Platzer et al. 1990, R1150 Smukala et al. 2000, R170 Bücker & Wagner 2006, R290 Lemmon et al. 2009);
// the arithmetic that turns them into a plan is done by hand below.
const SEA_LEVEL = { unit: 'kPa', atmosphericKpa: 101.325 } as const
const base: SubstitutionInput = {
  volumeL: 12, ambientC: 22, from: { designation: 'R13', chargeG: 600 }, to: 'R1150', basis: 'standing-pressure', evaporatingC: -85, display: SEA_LEVEL,
}
const plan = (over: Partial<SubstitutionInput> = {}) => planSubstitution({ ...base, ...over })
const available = (p: SubstitutionPlan | undefined) => {
  if (!p?.available) throw new Error('plan not available')
  return p
}

describe('R13 low stage refilled with R1150: 12 L, 600 g nameplate, 22 °C', () => {
  it('the nameplate charge stands at 1049.75 kPa abs (50 kg/m³ of R13 at 22 °C)', () => {
    expect(plan().from.standingPressureKpa).toBeCloseTo(1049.75, 1)
    expect(plan().from.phase).toBe('gas')
  })

  it('standing-pressure basis: ρ(R1150, 22 °C, 1049.75 kPa) = 12.8182 kg/m³, × 12 L = 153.82 g', () => {
    const r = plan()
    expect(r.basis).toBe('standing-pressure')
    expect(r.chargeG).toBeCloseTo(12.8182 * 12, 1)
    expect(r.standingPressureKpa).toBeCloseTo(1049.75, 1)
    expect(r.phase).toBe('supercritical')
    // About the same amount of substance: 600 / 104.459 = 5.744 mol of R13, 153.82 / 28.054 = 5.483 mol of R1150.
    expect(r.from.amountMol).toBeCloseTo(600 / 104.459, 3)
    expect(available(r.plans[0]).amountMol).toBeCloseTo(153.82 / 28.054, 2)
    expect(r.explanation).toMatch(/5\.74 mol of R13, 5\.48 mol of R1150/)
  })

  it('mass basis: 600 g of R1150 stands at 3363.8 kPa abs, 3.2 times the nameplate pressure, and says so', () => {
    const r = plan({ basis: 'mass' })
    expect(r.chargeG).toBe(600)
    expect(r.standingPressureKpa).toBeCloseTo(3363.85, 0)
    expect(available(r.plans[1]).ratioToNameplate).toBeCloseTo(3363.85 / 1049.75, 2)
    expect(r.warnings.join(' ')).toMatch(/3\.2 times the 1049\.8 kPa abs/)
  })

  it('liquid-volume basis at −85 °C: 600 g ÷ 1533.82 kg/m³ = 0.3912 L; × 539.91 kg/m³ = 211.20 g', () => {
    const r = plan({ basis: 'liquid-volume' })
    expect(r.chargeG).toBeCloseTo((600 / 1533.82) * 539.91, 1)
    expect(r.explanation).toMatch(/0\.391 L of saturated liquid/)
  })

  it('tabulates where the chosen charge stands from 10 to 35 °C: 12.818 kg/m³ of R1150 stands at 1082.3 kPa abs at 30 °C', () => {
    const r = plan()
    expect(r.standingByAmbient.map((x) => x.ambientC)).toEqual([10, 15, 20, 25, 30, 35])
    expect(r.standingByAmbient.find((x) => x.ambientC === 30)!.pressureKpa).toBeCloseTo(1082.27, 0) // CoolProp 8.0.0
    // Rising with the room, as an isochore does.
    for (let i = 1; i < r.standingByAmbient.length; i++) expect(r.standingByAmbient[i]!.pressureKpa).toBeGreaterThan(r.standingByAmbient[i - 1]!.pressureKpa)
  })

  it('shows all three bases side by side, each explained', () => {
    const r = plan()
    expect(r.plans.map((p) => p.basis)).toEqual(['standing-pressure', 'mass', 'liquid-volume'])
    for (const p of r.plans) expect(available(p).explanation.length).toBeGreaterThan(40)
    expect(available(r.plans[0]).explanation).toMatch(/^Same standing pressure/)
    expect(available(r.plans[1]).explanation).toMatch(/^Same mass/)
    expect(available(r.plans[2]).explanation).toMatch(/^Same liquid volume/)
  })

  it('flags the change of safety class A1 → A3 with charge limit, ventilation, labelling and local codes', () => {
    const w = plan().warnings.join(' ')
    expect(w).toMatch(/from A1 to A3/)
    expect(w).toMatch(/charge limit/)
    expect(w).toMatch(/ventilate/)
    expect(w).toMatch(/label the unit/)
    expect(w).toMatch(/Local codes/)
  })

  it('estimates the running head: R1150 at −25 °C 2218.2 kPa against R13 983.2 kPa, and warns (assumed cascade condenser)', () => {
    const r = plan()
    expect(r.runningHead).toMatchObject({ condensingC: -25, assumed: true })
    expect(r.runningHead.toKpa).toBeCloseTo(2218.2, 0)
    expect(r.runningHead.fromKpa).toBeCloseTo(983.2, 0)
    expect(r.warnings.join(' ')).toMatch(/Running head pressure/)
  })

  it('the reading to charge to, gauge at the site: 1049.75 kPa abs at 2000 m (79.50 kPa) is (1049.75 − 79.50) / 6.894757 = 140.7 psig', () => {
    const atmosphericKpa = 101.325 * Math.pow(1 - 2.25577e-5 * 2000, 5.25588) // ISO 2533
    const r = plan({ display: { unit: 'psig', atmosphericKpa } })
    expect(atmosphericKpa).toBeCloseTo(79.50, 2)
    expect(r.chargeTo!.value).toBeCloseTo((1049.75 - 79.50) / 6.894757, 1)
    expect(r.chargeTo!.text).toBe('140.7 psig')
    expect(r.chargeTo!.gauge).toBe(true)
    // The same plan at sea level reads lower on the gauge: (1049.75 − 101.325) / 6.894757 = 137.6 psig.
    expect(plan({ display: { unit: 'psig', atmosphericKpa: 101.325 } }).chargeTo!.text).toBe('137.6 psig')
  })

  it('against a design pressure of 2500 kPa abs: the mass plan is a danger, the standing-pressure plan is fine', () => {
    const r = plan({ designPressureKpa: 2500 })
    expect(available(r.plans[1]).warnings[0]).toMatch(/^DANGER: .*above the stage's design pressure/)
    expect(available(r.plans[0]).warnings.join(' ')).not.toMatch(/DANGER/)
    // 12.8 kg/m³ of R1150 would need well over twice its absolute temperature to reach 2500 kPa: not within the EOS range (to 176.9 °C).
    expect(available(r.plans[0]).reachesDesignPressureAtC).toBeUndefined()
    // Against 1500 kPa abs, the liquid-volume plan (1406.0 kPa abs at 22 °C) is within 10 % of it.
    expect(available(plan({ designPressureKpa: 1500 }).plans[2]).warnings.join(' ')).toMatch(/Close to the design pressure/)
  })

  it('a running head above the design pressure is a danger for every basis', () => {
    const r = plan({ designPressureKpa: 2000 })
    expect(r.warnings.join(' ')).toMatch(/DANGER: running, R1150 would condense at about 2218\.2 kPa abs/)
  })
})

describe('other substitutions', () => {
  it('R13 → R170 at the same standing pressure: ρ(R170, 22 °C, 1049.75 kPa) = 14.0753 kg/m³ × 12 L = 168.90 g', () => {
    const r = plan({ to: 'R170' })
    expect(r.chargeG).toBeCloseTo(14.0753 * 12, 1)
    expect(r.phase).toBe('gas')
  })

  it('R13 → R23: both A1, no safety-class warning, but the oil note (HFC in a CFC system)', () => {
    const r = plan({ to: 'R23' })
    expect(r.chargeG).toBeCloseTo(32.8208 * 12, 0) // ρ(R23, 22 °C, 1049.75 kPa) = 32.8208 kg/m³
    expect(r.warnings.join(' ')).not.toMatch(/Safety class/)
    expect(r.notes.join(' ')).toMatch(/does not mix with the mineral/)
  })

  it('an R12 high stage on the mass basis with R290: two-phase at ambient, so charge by weight, and flammable', () => {
    const r = plan({ from: { designation: 'R12', chargeG: 600 }, to: 'R290', basis: 'mass', volumeL: 4, evaporatingC: -30 })
    expect(r.phase).toBe('two-phase')
    expect(r.chargeTo).toBeNull()
    expect(r.warnings.join(' ')).toMatch(/Charge it by weight/)
    expect(r.warnings.join(' ')).toMatch(/from A1 to A3/)
    // R12 is partly liquid at 22 °C, so its standing pressure says nothing about the amount.
    expect(available(r.plans[0]).warnings.join(' ')).toMatch(/standing-pressure basis means little/)
  })

  it('a liquid-full plan is loud: 600 g of R290 in 1 L at 22 °C (denser than its 497.0 kg/m³ saturated liquid)', () => {
    const r = plan({ from: { designation: 'R12', chargeG: 600 }, to: 'R290', basis: 'mass', volumeL: 1, evaporatingC: -30 })
    expect(r.phase).toBe('liquid')
    expect(r.warnings[0]).toMatch(/^LIQUID-FULL/)
    expect(r.chargeTo).toBeNull()
  })

  it('a substitute that cannot condense at the given condensing temperature is flagged', () => {
    const r = plan({ condensingC: 15 })
    expect(r.runningHead.toKpa).toBeNull()
    expect(r.warnings.join(' ')).toMatch(/R1150 cannot condense at 15\.0 °C/)
  })

  it('an air-cooled nameplate refrigerant is assumed to condense 15 K above ambient', () => {
    const r = plan({ from: { designation: 'R12', chargeG: 600 }, to: 'R134a', basis: 'mass', volumeL: 4, evaporatingC: -30 })
    expect(r.runningHead).toMatchObject({ condensingC: 37, assumed: true })
  })
})

describe('ranges and side plans', () => {
  it('the liquid-volume plan is unavailable, not an error, when its evaporating temperature is missing and another basis is chosen', () => {
    const r = plan({ evaporatingC: undefined })
    const lv = r.plans[2]!
    expect(lv.available).toBe(false)
    expect(lv.available === false && lv.reason).toMatch(/evaporating temperature/)
  })

  it('a chosen basis that cannot be computed is an OutOfRangeError naming the range', () => {
    // 15 °C is above R1150's critical temperature (9.2 °C): there is no saturated liquid to compare.
    expect(() => plan({ basis: 'liquid-volume', evaporatingC: 15 })).toThrow(OutOfRangeError)
    expect(() => plan({ basis: 'liquid-volume', evaporatingC: 15 })).toThrow(/saturation is defined from .* to 9\.2 °C/)
    expect(() => plan({ ambientC: 900 })).toThrow(OutOfRangeError)
  })

  it('a plan beyond the equation of state is refused rather than answered in gigapascals', () => {
    expect(() => plan({ basis: 'mass', volumeL: 0.01 })).toThrow(/beyond the range of its equation of state/)
  })

  it('the same refrigerant gives the nameplate charge on every basis', () => {
    const r = plan({ to: 'R13' })
    for (const p of r.plans) expect(available(p).chargeG).toBeCloseTo(600, 6)
    expect(r.notes[0]).toMatch(/Same refrigerant/)
  })
})
