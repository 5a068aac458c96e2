import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

interface ErrorBody { message: string; data?: { fieldErrors?: Record<string, string[]>; range?: { minC: number; maxC: number } } }
type Body = Record<string, number | string | undefined> & ErrorBody

/** |value / reference − 1| below `rel` (0.3 % unless told). */
function near(value: unknown, reference: number, rel = 0.003) {
  expect(typeof value).toBe('number')
  expect(Math.abs((value as number) / reference - 1)).toBeLessThan(rel)
}

const sat = async (path: string) => (await signedIn(DEMO.tech)).get<Body>(`/api/refrigerants/${path}`)

describe('GET /api/refrigerants/{designation}/saturation', () => {
  it('pure fluid, temperature → pressure: R170 at −80 °C', async () => {
    const res = await sat('R170/saturation?temperatureC=-80')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ designation: 'R170', temperatureC: -80 })
    near(res.body.pressureKpa, 157.41) // Bücker & Wagner 2006 ethane EOS as tabulated by CoolProp 8.0.0
    expect(res.body.bubblePressureKpa).toBeUndefined()
  })

  it('pure fluid, pressure → temperature: R170 at 157.41 kPa and at 1 atm', async () => {
    const res = await sat('R170/saturation?pressureKpa=157.41')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ designation: 'R170', pressureKpa: 157.41 })
    expect(res.body.temperatureC as number).toBeCloseTo(-80, 1) // Bücker & Wagner 2006 via CoolProp 8.0.0
    const nbp = await sat('R170/saturation?pressureKpa=101.325')
    expect(nbp.body.temperatureC as number).toBeCloseTo(-88.58, 1) // normal boiling point, same source
  })

  it('blend, temperature → bubble and dew pressures: R404A at −40 °C', async () => {
    const res = await sat('R404A/saturation?temperatureC=-40')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ designation: 'R404A', temperatureC: -40 })
    near(res.body.bubblePressureKpa, 135.29) // Lemmon 2003 pseudo-pure R404A EOS as tabulated by CoolProp 8.0.0
    near(res.body.dewPressureKpa, 130.98) // same source
    expect(res.body.pressureKpa).toBeUndefined()
  })

  it('blend, pressure → bubble and dew temperatures with the glide: R404A', async () => {
    const bubble = await sat('R404A/saturation?pressureKpa=135.29')
    expect(bubble.status).toBe(200)
    expect(bubble.body.bubbleTemperatureC as number).toBeCloseTo(-40, 1) // Lemmon 2003 via CoolProp 8.0.0
    const dew = await sat('R404A/saturation?pressureKpa=130.98')
    expect(dew.body.dewTemperatureC as number).toBeCloseTo(-40, 1) // same source
    const glide = (dew.body.dewTemperatureC as number) - (dew.body.bubbleTemperatureC as number)
    expect(dew.body.glideK as number).toBeCloseTo(glide, 6)
    expect(glide).toBeGreaterThan(0.4) // R404A glides under 1 K (common practice, no source)
    expect(glide).toBeLessThan(1)
  })

  it('accepts a gauge reading with a unit: 15 psig of R170', async () => {
    const res = await sat('R170/saturation?pressure=15&unit=psig')
    expect(res.status).toBe(200)
    // 15 psi × 6.894757 kPa/psi + 101.325 kPa (NIST SP 811 psi factor; ISO 2533 sea-level atmosphere)
    near(res.body.pressureKpa, 204.746, 1e-5)
  })

  it('reads a gauge pressure against the altitude: 15 psig of R290 is −24.8 °C at sea level, −27.8 °C at 2000 m', async () => {
    // 15 psig at 2000 m: 15 × 6.894757 + 79.495 kPa (ISO 2533) = 182.92 kPa abs; propane saturation temperatures
    // at 204.75 and 182.92 kPa from the Lemmon et al. 2009 EOS as computed with CoolProp 8.0.0: −24.83 and −27.79 °C.
    const sea = await sat('R290/saturation?pressure=15&unit=psig')
    const high = await sat('R290/saturation?pressure=15&unit=psig&altitudeM=2000')
    expect(high.status).toBe(200)
    near(high.body.pressureKpa, 182.917, 1e-4)
    expect(high.body.temperatureC as number).toBeCloseTo(-27.79, 1)
    expect(sea.body.temperatureC as number).toBeCloseTo(-24.83, 1)
    expect(high.body.input).toMatchObject({ value: 15, unit: 'psig', altitudeM: 2000, atmosphericKpa: expect.closeTo(79.495, 2) })
  })

  it('accepts vacuum units: 29 inHg vacuum of R23 at sea level is 3.124 kPa abs', async () => {
    const res = await sat('R23/saturation?pressure=29&unit=inHgV')
    expect(res.status).toBe(200)
    near(res.body.pressureKpa, 101.325 - 29 * 3.386389, 1e-4) // 1 inHg = 3.386389 kPa (conventional)
  })

  it('knows R13 and R12: −60 °C → 280.15 kPa (Platzer 1990 EOS), 0 °C → 308.15 kPa (Marx 1992 EOS), both via CoolProp 8.0.0', async () => {
    near((await sat('R13/saturation?temperatureC=-60')).body.pressureKpa, 280.15, 0.001)
    near((await sat('R12/saturation?temperatureC=0')).body.pressureKpa, 308.15, 0.001)
    const r503 = await sat('R503/saturation?temperatureC=-90')
    near(r503.body.bubblePressureKpa, 88.919, 0.01) // R23/R13 mixture model as computed with CoolProp 8.0.0
  })

  it('answers 422 naming the field for a gauge reading below a perfect vacuum', async () => {
    const res = await sat('R170/saturation?pressure=-20&unit=psig')
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/below a perfect vacuum/)
    expect(res.body.data?.fieldErrors?.pressure).toBeDefined()
  })

  it('answers 422 naming the valid range for a state outside it', async () => {
    const res = await sat('R170/saturation?temperatureC=40')
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/−?-?182\.8 °C to 32\.2 °C/)
    expect(res.body.data?.range?.maxC).toBeCloseTo(32.17, 1)
    const high = await sat('R404A/saturation?pressureKpa=99999')
    expect(high.status).toBe(422)
    expect(high.body.message).toMatch(/defined from .* to .*kPa/)
  })

  it('answers 400 with field errors for both, neither or non-numeric parameters', async () => {
    for (const query of ['temperatureC=-80&pressureKpa=120', '', 'temperatureC=cold', 'pressureKpa=', 'temperatureC=1&temperatureC=2', 'pressure=15&unit=C', 'pressure=15&unit=psig&altitudeM=99999', 'pressure=15&unit=psig&altitudeM=10&atmosphericKpa=100', 'pressure=15&unit=inHg']) {
      const res = await sat(`R170/saturation?${query}`)
      expect(res.status, query).toBe(400)
      expect(Object.keys(res.body.data?.fieldErrors ?? {}).length, query).toBeGreaterThan(0)
    }
  })

  it('answers 404 for an unknown designation and 401 when signed out', async () => {
    const res = await sat('R12345/saturation?temperatureC=-80')
    expect(res.status).toBe(404)
    expect(res.body.message).toContain('R12345')
    expect((await new ApiClient().get('/api/refrigerants/R170/saturation?temperatureC=-80')).status).toBe(401)
  })
})
