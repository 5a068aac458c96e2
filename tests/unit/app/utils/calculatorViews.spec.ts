import { describe, expect, it } from 'vitest'
import { findRefrigerant, type RefrigerantInfo } from '#shared/utils/properties'
import { localAtmosphere, pressureFromTemperature, standingView, temperatureFromPressure, type StandingForm } from '~/utils/calculatorViews'

const info = (d: string): RefrigerantInfo => findRefrigerant(d)!
const ok = <T extends { state: string }>(v: T) => {
  expect(v.state).toBe('ok')
  return v as Extract<T, { state: 'ok' }>
}

describe('pressure from a typed temperature', () => {
  it('R170 at −80 °C, also typed in °F and K', () => {
    // 157.41 kPa: Bücker & Wagner 2006 ethane EOS as tabulated by CoolProp 8.0.0
    for (const [text, unit] of [['-80', 'C'], ['-112', 'F'], ['193.15', 'K']] as const) {
      const v = ok(pressureFromTemperature(info('R170'), text, unit))
      expect(v.rows).toHaveLength(1)
      expect(v.rows[0]!.pressureKpa).toBeCloseTo(157.41, 1)
    }
  })

  it('a blend gives bubble and dew rows: R404A at −40 °C', () => {
    const v = ok(pressureFromTemperature(info('R404A'), '-40', 'C'))
    // 135.29 / 130.98 kPa: Lemmon 2003 pseudo-pure R404A EOS as tabulated by CoolProp 8.0.0
    expect(v.rows.map((r) => r.label)).toEqual(['Bubble (liquid)', 'Dew (vapour)'])
    expect(v.rows[0]!.pressureKpa).toBeCloseTo(135.29, 1)
    expect(v.rows[1]!.pressureKpa).toBeCloseTo(130.98, 1)
  })

  it('explains a bad number or a temperature outside the range, never NaN', () => {
    expect(pressureFromTemperature(info('R170'), '', 'C')).toEqual({ state: 'empty' })
    const bad = pressureFromTemperature(info('R170'), 'cold', 'C')
    expect(bad).toMatchObject({ state: 'invalid', message: expect.stringMatching(/Type a number/) })
    const hot = pressureFromTemperature(info('R170'), '40', 'C')
    expect(hot).toMatchObject({ state: 'invalid', message: expect.stringMatching(/32\.2 °C/) })
    expect(JSON.stringify(hot)).not.toContain('NaN')
  })
})

describe('temperature from a typed pressure', () => {
  it('a gauge reading adds the local atmosphere: 56.085 kPag of R170 at sea level is −80 °C', () => {
    // 157.41 kPa abs − 101.325 kPa (ISO 2533 sea level) = 56.085 kPag; Bücker & Wagner 2006 via CoolProp 8.0.0
    const v = ok(temperatureFromPressure(info('R170'), '56.085', 'kPag', 101.325))
    expect(v.inputKpa).toBeCloseTo(157.41, 2)
    expect(v.rows[0]!.temperatureC).toBeCloseTo(-80, 1)
  })

  it('gives a blend its glide', () => {
    const v = ok(temperatureFromPressure(info('R404A'), '135.29', 'kPa', 101.325))
    expect(v.rows[0]!.temperatureC).toBeCloseTo(-40, 1) // bubble, Lemmon 2003 via CoolProp 8.0.0
    expect(v.glideK).toBeCloseTo(v.rows[1]!.temperatureC - v.rows[0]!.temperatureC, 9)
  })

  it('refuses a gauge reading below a perfect vacuum', () => {
    expect(temperatureFromPressure(info('R170'), '-200', 'kPag', 101.325)).toMatchObject({ state: 'invalid', message: expect.stringMatching(/vacuum/) })
  })
})

describe('standing-pressure check', () => {
  const form = (f: Partial<StandingForm>): StandingForm => ({ ambient: '20', charge: '300', volume: '10', measured: '', measuredUnit: 'kPa', ...f })

  it('expected pressure of 300 g ethane in 10 L at 20 °C, and 100 % back from that pressure', () => {
    // 1992.3 kPa: Bücker & Wagner 2006 ethane EOS at 20 °C and 30 kg/m³, as computed with CoolProp 8.0.0
    const v = standingView(info('R170'), form({ measured: '1992.3' }), 101.325)
    expect(v.errors).toEqual({})
    expect(v.expected?.pressureKpa).toBeCloseTo(1992.3, 0)
    expect(v.measured?.percentOfNameplate).toBeCloseTo(100, 0)
    expect(v.measured?.phase).toBe('gas')
  })

  it('checks against the stage design pressure when the stage brings one', () => {
    // 1992.3 kPa abs expected (Bücker & Wagner 2006 via CoolProp 8.0.0) against a 1900 kPa abs design pressure: over it.
    const over = standingView(info('R170'), form({}), 101.325, undefined, 1900)
    expect(over.expected?.warnings.join(' ')).toMatch(/DANGER: at 20\.0 °C this stands at .*above the stage's design pressure/)
    expect(standingView(info('R170'), form({}), 101.325, undefined, 10_000).expected?.warnings.join(' ')).not.toMatch(/design pressure/)
    expect(standingView(info('R170'), form({}), 101.325).expected?.warnings.join(' ')).not.toMatch(/design pressure/)
  })

  it('reads a gauge measurement with the local atmosphere', () => {
    const v = standingView(info('R170'), form({ measured: '1890.975', measuredUnit: 'kPag' }), 101.325)
    expect(v.measured?.chargeG).toBeCloseTo(300, 0)
  })

  it('flags field errors in the API\'s words and computes nothing from them', () => {
    const v = standingView(info('R170'), form({ volume: '0', ambient: 'warm' }), 101.325)
    expect(v.errors.ambient).toMatch(/Type a number/)
    expect(v.expected).toBeUndefined()
    const w = standingView(info('R170'), form({ volume: '-2' }), 101.325)
    expect(w.errors.volume).toMatch(/above 0 L/)
  })

  it('says the pressure cannot tell the charge when liquid is present (R23, 500 g in 1 L at 20 °C; 4170 kPa is just above its 4161 kPa saturation pressure, Penoncello et al. 2003 via CoolProp 8.0.0)', () => {
    const v = standingView(info('R23'), form({ charge: '500', volume: '1', measured: '4170' }), 101.325)
    expect(v.expected?.phase).toBe('two-phase')
    expect(v.measured?.chargeIsMinimum).toBe(true)
  })

  it('reports an ambient outside the model range as a problem', () => {
    expect(standingView(info('R170'), form({ ambient: '900' }), 101.325).problem).toMatch(/defined from/)
  })
})

describe('localAtmosphere', () => {
  it('uses the ISO 2533 standard atmosphere at the site altitude, else sea level', () => {
    // ISO 2533 troposphere: p = 101.325 kPa × (1 − 2.25577e-5 × h)^5.25588
    expect(localAtmosphere({ altitudeM: 1450, name: 'Site' }).kpa).toBeCloseTo(85.076, 2)
    expect(localAtmosphere().kpa).toBe(101.325)
    expect(localAtmosphere({ altitudeM: 20000, name: 'Balloon' })).toMatchObject({ kpa: 101.325, source: expect.stringMatching(/outside/) })
  })
})

describe('standing-pressure check from a recorded reference reading', () => {
  it('carries the reference to the ambient along the isochore, even without a volume', () => {
    const form: StandingForm = { ambient: '30', charge: '', volume: '', measured: '', measuredUnit: 'kPag' }
    const v = standingView(info('R170'), form, 101.325, { pressureKpa: 1992.3, ambientC: 20 })
    // A fixed gas fill rises with temperature (physics); at the same ambient it must return the reference itself.
    expect(v.fromReference?.pressureKpa).toBeGreaterThan(1992.3)
    const same = standingView(info('R170'), { ...form, ambient: '20' }, 101.325, { pressureKpa: 1992.3, ambientC: 20 })
    expect(same.fromReference?.pressureKpa).toBeCloseTo(1992.3, 1)
    expect(same.expected).toBeUndefined()
  })
})
