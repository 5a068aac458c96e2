import { describe, expect, it } from 'vitest'
import { assessFGasEquipment, co2eOfCharge } from '#server/domain/compliance/f-gas'
import { NotFoundError } from '#server/domain/errors'

describe('co2eOfCharge: t CO2e = kg × GWP ÷ 1000 and the leak-check interval', () => {
  // Reg. (EU) 517/2014 Art. 2(7) and Annex IV: R508B GWP 13 396 (mass-weighted AR4 values of Annex I:
  // 46 % × 14 800 + 54 % × 12 200); 0.5 kg × 13 396 / 1000 = 6.698 t. Art. 4(3)(a): 5 to 50 t → 12 months.
  it('0.5 kg R508B under the 2014 regulation: 6.698 t, a check every 12 months', () => {
    const r = co2eOfCharge({ designation: 'R508B', chargeG: 500, basis: 'eu-2014' })
    expect(r).toMatchObject({ tonnesCo2e: 6.698, gwp: 13396, leakCheckIntervalMonths: 12, fGas: true, leakCheckRequired: true })
  })

  // Reg. (EU) 2024/573 Annex I: R508B 13 504 (HFC-23 14 800, PFC-116 12 400); 0.5 × 13 504 / 1000 = 6.752 t.
  it('0.5 kg R508B under the 2024 regulation: 6.752 t, 12 months', () => {
    expect(co2eOfCharge({ designation: 'R508B', chargeG: 500, basis: 'eu-2024' })).toMatchObject({ tonnesCo2e: 6.752, gwp: 13504, leakCheckIntervalMonths: 12 })
  })

  // Reg. (EU) 517/2014 Art. 4(2): labelled hermetically sealed equipment under 10 t CO2e is not leak-checked.
  it('exempts a labelled hermetically sealed unit under 10 t', () => {
    const r = co2eOfCharge({ designation: 'R508B', chargeG: 500, basis: 'eu-2014', hermeticallySealed: true })
    expect(r).toMatchObject({ leakCheckIntervalMonths: null, leakCheckRequired: false, hermeticExemption: true })
    expect(r.text.join(' ')).toMatch(/hermetically sealed/)
  })

  // 3 kg R404A × 3 922 (Annex IV sum: 44 % × 3 500 + 52 % × 4 470 + 4 % × 1 430) / 1000 = 11.766 t:
  // over the 10 t limit of the hermetic exemption, so the 12-month check stands (Art. 4(2), 4(3)(a)).
  it('keeps the check for a hermetically sealed 3 kg R404A unit (11.77 t ≥ 10 t)', () => {
    const r = co2eOfCharge({ designation: 'R404A', chargeG: 3000, basis: 'eu-2014', hermeticallySealed: true })
    expect(r.tonnesCo2e).toBeCloseTo(11.766, 6)
    expect(r).toMatchObject({ leakCheckIntervalMonths: 12, hermeticExemption: false })
  })

  // Art. 4(3)(a)–(c) of 517/2014: 5–50 t 12 months, 50–500 t 6 months, ≥ 500 t 3 months; the 24/12/6
  // months with a leak detection system are from memory of the same paragraph.
  it('follows the 50 t and 500 t bands and doubles the interval with a leak detection system', () => {
    // 40 kg R404A = 156.88 t → 6 months, 12 with detection
    expect(co2eOfCharge({ designation: 'R404A', chargeG: 40_000, basis: 'eu-2014' }).leakCheckIntervalMonths).toBe(6)
    expect(co2eOfCharge({ designation: 'R404A', chargeG: 40_000, basis: 'eu-2014', leakDetectionSystem: true }).leakCheckIntervalMonths).toBe(12)
    // 150 kg R404A = 588.3 t → 3 months, 6 with detection; detection is mandatory (Art. 5(1)).
    const big = co2eOfCharge({ designation: 'R404A', chargeG: 150_000, basis: 'eu-2014' })
    expect(big).toMatchObject({ leakCheckIntervalMonths: 3, leakDetectionSystemRequired: true })
    expect(co2eOfCharge({ designation: 'R404A', chargeG: 150_000, basis: 'eu-2014', leakDetectionSystem: true }).leakCheckIntervalMonths).toBe(6)
    // exactly 5 t is in scope ("5 tonnes of CO2 equivalent or more"): 5000/1.43 g of R134a (GWP 1 430) is 5 t;
    // 3 496 g is 4.999 t, below it
    expect(co2eOfCharge({ designation: 'R134a', chargeG: 5000 / 1.43, basis: 'eu-2014' }).leakCheckIntervalMonths).toBe(12)
    expect(co2eOfCharge({ designation: 'R134a', chargeG: 3496, basis: 'eu-2014' }).leakCheckIntervalMonths).toBeNull()
  })

  // Reg. (EU) 2024/573 Annex I uses AR6 for PFCs: PFC-14 7 380 against 7 390 in 517/2014.
  it('uses each regulation’s own GWP for R14', () => {
    expect(co2eOfCharge({ designation: 'R14', chargeG: 1000, basis: 'eu-2014' }).gwp).toBe(7390)
    expect(co2eOfCharge({ designation: 'R14', chargeG: 1000, basis: 'eu-2024' }).gwp).toBe(7380)
  })

  // Ethane, ethylene and propane are hydrocarbons, CO2 and ammonia natural refrigerants: not F-gases
  // (517/2014 Art. 2(1) and Annex I; 2024/573 Art. 2 and Annexes I–III). Annex IV of 517/2014 still gives
  // ethane a GWP of 6 for mixtures.
  it('says so for gases outside the F-gas rules, with no leak-check interval', () => {
    const ethane = co2eOfCharge({ designation: 'R170', chargeG: 300, basis: 'eu-2014' })
    expect(ethane).toMatchObject({ fGas: false, scope: 'not-f-gas', gwp: 6, leakCheckIntervalMonths: null, leakCheckRequired: false })
    expect(ethane.tonnesCo2e).toBeCloseTo(0.0018, 10)
    expect(ethane.text[0]).toMatch(/not a fluorinated greenhouse gas/)
    const propane2024 = co2eOfCharge({ designation: 'R290', chargeG: 150, basis: 'eu-2024' })
    expect(propane2024).toMatchObject({ gwp: 0.02, leakCheckIntervalMonths: null }) // 2024/573 Annex VI (AR6) value 0.02
    expect(propane2024.tonnesCo2e).toBeCloseTo(0.000003, 12)
    for (const d of ['R1150', 'R744', 'R717', 'R22']) {
      for (const basis of ['eu-2014', 'eu-2024'] as const) expect(co2eOfCharge({ designation: d, chargeG: 5000, basis }).leakCheckIntervalMonths, `${d} ${basis}`).toBeNull()
    }
    expect(co2eOfCharge({ designation: 'R22', chargeG: 5000, basis: 'eu-2024' }).text[0]).toMatch(/ozone/)
  })

  // UBA FAQ on Reg. (EU) 2024/573 (section 2): Annex II group 1 gases are counted in kilograms, leak checks
  // from 1 kg; the intervals of the kilogram bands are from memory.
  it('counts unsaturated HFCs in kilograms under 2024 only', () => {
    expect(co2eOfCharge({ designation: 'R1234yf', chargeG: 1500, basis: 'eu-2024' })).toMatchObject({ scope: 'annex-ii-group-1', leakCheckIntervalMonths: 12 })
    expect(co2eOfCharge({ designation: 'R1234yf', chargeG: 1500, basis: 'eu-2024', hermeticallySealed: true }).leakCheckIntervalMonths).toBeNull() // under 2 kg, Art. 5(1)(b)
    const in2014 = co2eOfCharge({ designation: 'R1234yf', chargeG: 1500, basis: 'eu-2014' })
    expect(in2014.leakCheckIntervalMonths).toBeNull()
    expect(in2014.text.join(' ')).toMatch(/Annex II: labelling and reporting only/)
    expect(in2014.text.join(' ')).not.toMatch(/Below 5 t/)
  })

  it('accepts written-out designations and refuses unknown ones', () => {
    expect(co2eOfCharge({ designation: 'r-404a', chargeG: 1000, basis: 'eu-2014' }).designation).toBe('R404A')
    expect(() => co2eOfCharge({ designation: 'R9999', chargeG: 1000, basis: 'eu-2014' })).toThrow(NotFoundError)
  })
})

describe('assessFGasEquipment: a cascade unit as one piece of equipment', () => {
  // 0.6 kg R404A (2.353 t) + 0.3 kg R508B (4.019 t) = 6.372 t ≥ 5 t → 12 months (517/2014 Art. 4(3)(a)),
  // although neither circuit alone reaches 5 t.
  it('adds the circuits together', () => {
    const r = assessFGasEquipment({ basis: 'eu-2014', circuits: [{ designation: 'R404A', chargeG: 600 }, { designation: 'R508B', chargeG: 300 }] })
    expect(r.annexITonnesCo2e).toBeCloseTo(6.3720, 4)
    expect(r.leakCheckIntervalMonths).toBe(12)
    expect(r.text.join(' ')).toMatch(/circuits counted together/)
  })

  it('ignores a hydrocarbon high stage when adding up', () => {
    const r = assessFGasEquipment({ basis: 'eu-2024', circuits: [{ designation: 'R290', chargeG: 150 }, { designation: 'R170', chargeG: 120 }] })
    expect(r).toMatchObject({ annexITonnesCo2e: 0, leakCheckRequired: false, leakCheckIntervalMonths: null })
  })
})
