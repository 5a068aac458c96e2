import { describe, expect, it } from 'vitest'
import { DESIGNATIONS, designationsMatching, findRefrigerant, isDesignation, listRefrigerants, saturationPressure, saturationTemperature } from '#shared/utils/properties'

describe('refrigerant catalogue', () => {
  it('lists every designation once, in order', () => {
    expect(listRefrigerants().map((r) => r.designation)).toEqual([...DESIGNATIONS])
    expect(DESIGNATIONS).toHaveLength(20)
    // The designations scripts outside the app rely on, plus the original fills of older cascade units.
    for (const d of ['R1150', 'R170', 'R290', 'R600a', 'R1270', 'R50', 'R14', 'R23', 'R116', 'R508B', 'R404A', 'R507A', 'R134a', 'R22', 'R410A', 'R744', 'R717', 'R13', 'R12', 'R503']) {
      expect(isDesignation(d), d).toBe(true)
    }
  })

  it('finds exact and case-insensitive designations; rejects others', () => {
    expect(findRefrigerant('R23')?.name).toBe('trifluoromethane')
    expect(findRefrigerant('r23')?.designation).toBe('R23')
    expect(findRefrigerant('r600A')?.designation).toBe('R600a')
    expect(findRefrigerant('R999')).toBeUndefined()
    expect(isDesignation('R23')).toBe(true)
    expect(isDesignation('r23')).toBe(false)
  })

  it('turns a search text into the designations it names, by chemical name or hyphenated designation', () => {
    expect(designationsMatching('ethylene')).toEqual(['R1150'])
    expect(designationsMatching('Ethane')).toEqual(['R170'])
    expect(designationsMatching('propane')).toEqual(['R290'])
    expect(designationsMatching('R-1150')).toEqual(['R1150'])
    expect(designationsMatching('azeotropic')).toEqual(['R508B', 'R503', 'R507A'].sort((a, b) => DESIGNATIONS.indexOf(a as never) - DESIGNATIONS.indexOf(b as never)))
    expect(designationsMatching('methane')).toEqual(['R50'])
    expect(designationsMatching('carbon dioxide')).toEqual(['R744'])
    expect(designationsMatching('et')).toEqual([])
    expect(designationsMatching('freezer')).toEqual([])
  })

  it('critical points: EOS values (Span & Wagner 1996 CO2 304.128 K / 7.3773 MPa; Platzer 1990 R14 EOS critical point 227.40 K / 3.7625 MPa, CoolProp 8.0.0)', () => {
    expect(findRefrigerant('R744')!.criticalTemperatureC).toBeCloseTo(304.128 - 273.15, 2)
    expect(findRefrigerant('R744')!.criticalPressureKpa).toBeCloseTo(7377.3, 0)
    expect(findRefrigerant('R14')!.criticalTemperatureC).toBeCloseTo(227.4 - 273.15, 1)
    expect(findRefrigerant('R1150')!.criticalPressureKpa).toBeCloseTo(5041.8, -1) // Nowak et al. 1996: 5.0418 MPa
  })

  it('R508B: mixture-model critical point ~11.4 °C / 3.82 MPa (CoolProp 8.0.0 model); producer literature 11.2 °C / 3.77 MPa (from memory)', () => {
    const r = findRefrigerant('R508B')!
    expect(r.criticalTemperatureC).toBeCloseTo(11.4, 0)
    expect(r.criticalPressureKpa / 1000).toBeCloseTo(3.82, 1)
    expect(r.composition).toEqual([{ component: 'R23', massPercent: 46 }, { component: 'R116', massPercent: 54 }])
    expect(r.molarMassGPerMol).toBeCloseTo(95.39, 1)
  })

  it('safety classes and flags (ASHRAE 34 as recorded in CoolProp 8.0.0; R717 B2L since 2010, from memory)', () => {
    expect(findRefrigerant('R717')).toMatchObject({ safetyClass: 'B2L', flammable: true, toxic: true })
    expect(findRefrigerant('R290')).toMatchObject({ safetyClass: 'A3', flammable: true, toxic: false })
    expect(findRefrigerant('R23')).toMatchObject({ safetyClass: 'A1', flammable: false, toxic: false })
    for (const r of listRefrigerants()) {
      expect(r.cautions.some((c) => c.startsWith('Cold burns'))).toBe(true)
      if (r.flammable) expect(r.cautions.some((c) => c.startsWith('Flammable'))).toBe(true)
      expect(r.cautions.join(' ')).not.toMatch(/ignit(e|ing) (it|the refrigerant)|flame test/i)
    }
  })

  it('GWP (40 CFR 98 Table A-1, AR4; blends mass-weighted per Reg. (EU) 517/2014 Annex IV; EU 2024/573)', () => {
    expect(findRefrigerant('R23')!.gwpAR4).toBe(14800)
    expect(findRefrigerant('R404A')!.gwpAR4).toBe(3922)
    expect(findRefrigerant('R508B')).toMatchObject({ gwpEu2014: 13396, gwpEu2024: 13504 })
    expect(findRefrigerant('R290')).toMatchObject({ gwpAR5: null, gwpEu2024: 0.02 })
    expect(findRefrigerant('R290')!.gwpNote).toMatch(/IPCC/)
  })

  it('highPressure flag follows its documented rule: p_sat(20 °C) ≥ 1.4 MPa or no liquid at 20 °C', () => {
    for (const r of listRefrigerants()) {
      const rule = r.criticalTemperatureC <= 20 || saturationPressure(r.designation, 20).bubbleKpa >= 1400
      expect(r.highPressure, r.designation).toBe(rule)
    }
  })

  it('valid range is from the triple point (or lowest ancillary temperature) to the critical point', () => {
    const r = findRefrigerant('R170')!
    expect(r.validRange.minC).toBeCloseTo(90.368 - 273.15, 3) // Bücker & Wagner 2006 triple point
    expect(r.validRange.maxC).toBeCloseTo(305.322 - 273.15, 3)
    expect(saturationTemperature('R170', r.criticalPressureKpa).dewC).toBeCloseTo(r.validRange.maxC, 6)
  })

  it('returns copies (callers cannot corrupt the catalogue)', () => {
    const a = findRefrigerant('R23')!
    a.cautions.push('x')
    a.validRange.minC = 0
    expect(findRefrigerant('R23')!.cautions).not.toContain('x')
    expect(findRefrigerant('R23')!.validRange.minC).not.toBe(0)
  })
})
