import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../helpers'

interface Plan { basis: string; available: boolean; chargeG?: number; standingPressureKpa?: number; phase?: string; explanation?: string; reason?: string }
interface Substitution {
  chargeG: number
  standingPressureKpa: number
  phase: string
  basis: string
  warnings: string[]
  chargeTo: { value: number; unit: string; text: string; atmosphericKpa: number } | null
  explanation: string
  from: { standingPressureKpa: number }
  plans: Plan[]
  message?: string
  data?: { fieldErrors?: Record<string, string[]>; range?: { minC: number; maxC: number } }
}

const URL = '/api/calculations/substitution'
const post = async (body: unknown) => (await signedIn(DEMO.tech)).post<Substitution>(URL, body)
// The worked example: a 12 L R13 low stage with its 600 g nameplate charge, refilled with ethylene at 22 °C.
const body = { volumeL: 12, ambientC: 22, from: { designation: 'R13', chargeG: 600 }, to: 'R1150', basis: 'standing-pressure' }

describe('POST /api/calculations/substitution', () => {
  it('standing-pressure basis: 153.8 g of R1150 stands where 600 g of R13 does, 1049.8 kPa abs', async () => {
    const res = await post(body)
    expect(res.status).toBe(200)
    // R13 (Platzer 1990) and R1150 (Smukala 2000) EOS via CoolProp 8.0.0: 50 kg/m³ of R13 at 22 °C stands at
    // 1049.75 kPa; R1150 at that pressure is 12.8182 kg/m³, × 12 L = 153.8 g.
    expect(res.body).toMatchObject({ basis: 'standing-pressure', phase: 'supercritical' })
    expect(res.body.chargeG).toBeCloseTo(153.8, 1)
    expect(res.body.standingPressureKpa).toBeCloseTo(1049.75, 1)
    expect(res.body.warnings.join(' ')).toMatch(/from A1 to A3/)
    expect(res.body.plans.map((p) => p.basis)).toEqual(['standing-pressure', 'mass', 'liquid-volume'])
    // Without evaporatingC the liquid-volume plan is shown as unavailable, with its reason.
    expect(res.body.plans[2]).toMatchObject({ available: false, reason: expect.stringMatching(/evaporating temperature/) })
  })

  it('mass basis: 600 g of R1150 stands at 3364 kPa abs, far above the nameplate, and warns', async () => {
    const res = await post({ ...body, basis: 'mass' })
    expect(res.body.chargeG).toBe(600)
    expect(res.body.standingPressureKpa).toBeCloseTo(3363.8, 0) // same sources as above
    expect(res.body.warnings.join(' ')).toMatch(/times the 1049\.8 kPa abs/)
  })

  it('liquid-volume basis at −85 °C: 600 g × 539.91 / 1533.82 = 211.2 g', async () => {
    const res = await post({ ...body, basis: 'liquid-volume', evaporatingC: -85 })
    expect(res.status).toBe(200)
    // Saturated liquid densities at −85 °C via CoolProp 8.0.0: R13 1533.82, R1150 539.91 kg/m³.
    expect(res.body.chargeG).toBeCloseTo((600 * 539.91) / 1533.82, 1)
    expect(res.body.explanation).toMatch(/Same liquid volume/)
  })

  it('gives the reading to charge to in the technician\'s unit, gauge at the site altitude', async () => {
    const res = await post({ ...body, unit: 'psig', altitudeM: 2000 })
    // (1049.75 − 79.495) / 6.894757 = 140.7 psig (ISO 2533 atmosphere at 2000 m; NIST SP 811 psi factor)
    expect(res.body.chargeTo).toMatchObject({ unit: 'psig', text: '140.7 psig' })
    expect(res.body.chargeTo!.atmosphericKpa).toBeCloseTo(79.495, 2)
  })

  it('warns against a design pressure given as a gauge value', async () => {
    // 25 barg at sea level = 2601.3 kPa abs; the mass plan stands at 3363.8 kPa abs.
    const res = await post({ ...body, basis: 'mass', designPressure: 25, unit: 'barg' })
    expect(res.body.warnings[0]).toMatch(/^DANGER/)
  })

  it('is loud about a liquid-full plan: 600 g of R290 in a 1 L R12 stage', async () => {
    const res = await post({ volumeL: 1, ambientC: 22, from: { designation: 'R12', chargeG: 600 }, to: 'R290', basis: 'mass' })
    expect(res.status).toBe(200)
    // 600 kg/m³ is denser than saturated liquid propane at 22 °C (497.0 kg/m³, Lemmon et al. 2009 EOS via CoolProp 8.0.0).
    expect(res.body.phase).toBe('liquid')
    expect(res.body.warnings[0]).toMatch(/^LIQUID-FULL/)
    expect(res.body.chargeTo).toBeNull()
  })

  it('answers 404 for an unknown designation, naming it', async () => {
    const from = await post({ ...body, from: { designation: 'R9999', chargeG: 600 } })
    expect(from.status).toBe(404)
    expect(from.body.message).toContain('R9999')
    const to = await post({ ...body, to: 'R4242' })
    expect(to.status).toBe(404)
    expect(to.body.message).toContain('R4242')
  })

  it('answers 422 naming the range for a state outside it', async () => {
    // 15 °C is above ethylene's critical temperature (9.2 °C, Smukala 2000 EOS): no saturated liquid to compare.
    const res = await post({ ...body, basis: 'liquid-volume', evaporatingC: 15 })
    expect(res.status).toBe(422)
    expect(res.body.message).toMatch(/R1150 saturation is defined from .* to 9\.2 °C/)
    expect(res.body.data?.range?.maxC).toBeCloseTo(9.2, 1)
    const hot = await post({ ...body, ambientC: 900 })
    expect(hot.status).toBe(422)
    expect(hot.body.message).toMatch(/defined from .*°C to .*°C/)
  })

  it('answers 400 with field errors for malformed input', async () => {
    const cases: [string, unknown, string][] = [
      ['missing basis', { ...body, basis: undefined }, 'basis'],
      ['unknown basis', { ...body, basis: 'moles' }, 'basis'],
      ['liquid volume without evaporating temperature', { ...body, basis: 'liquid-volume' }, 'evaporatingC'],
      ['missing nameplate', { ...body, from: undefined }, 'from'],
      ['nameplate charge zero', { ...body, from: { designation: 'R13', chargeG: 0 } }, 'from.chargeG'],
      ['volume as text', { ...body, volumeL: '12' }, 'volumeL'],
      ['design pressure without unit', { ...body, designPressure: 25 }, 'unit'],
      ['altitude and atmosphere', { ...body, altitudeM: 10, atmosphericKpa: 100 }, 'altitudeM'],
    ]
    for (const [what, b, field] of cases) {
      const res = await post(b)
      expect(res.status, what).toBe(400)
      expect(res.body.data?.fieldErrors?.[field], what).toBeDefined()
    }
    // A form-encoded body is refused by its type before it is read.
    expect((await post('volumeL=12')).status).toBe(415)
  })

  it('answers 401 when signed out', async () => {
    expect((await new ApiClient().post(URL, body)).status).toBe(401)
  })
})

describe('POST /api/calculations/charging', () => {
  const charging = { designation: 'R1150', volumeL: 12, ambientC: 22, targetChargeG: 153.8 }
  const postCharging = async (b: unknown) => (await signedIn(DEMO.tech)).post<{ chargeNowG: number; toGoG: number; percentOfTarget: number; standingPressureKpa: number; target: { reading: { text: string } | null }; message?: string; data?: { fieldErrors?: Record<string, string[]> } }>('/api/calculations/charging', b)

  it('from a gauge reading: 100 psig of R1150 in 12 L at 22 °C is 113.9 g, 39.9 g to go', async () => {
    const res = await postCharging({ ...charging, pressure: 100, unit: 'psig' })
    expect(res.status).toBe(200)
    // 100 psig = 790.8 kPa abs at sea level; Smukala 2000 EOS via CoolProp 8.0.0: 9.491 kg/m³ × 12 L = 113.9 g.
    expect(res.body.chargeNowG).toBeCloseTo(113.9, 1)
    expect(res.body.toGoG).toBeCloseTo(39.9, 1)
    expect(res.body.target.reading!.text).toBe('137.5 psig')
  })

  it('from grams weighed in: the pressure to expect', async () => {
    const res = await postCharging({ ...charging, targetChargeG: 200, addedG: 120 })
    // 10 kg/m³ of R1150 at 22 °C: 830.99 kPa abs (Smukala 2000 EOS via CoolProp 8.0.0)
    expect(res.body.standingPressureKpa).toBeCloseTo(830.99, 0)
    expect(res.body.percentOfTarget).toBe(60)
  })

  it('answers 404, 422 and 400 as the other calculations do', async () => {
    expect((await postCharging({ ...charging, designation: 'R0', addedG: 1 })).status).toBe(404)
    expect((await postCharging({ ...charging, ambientC: -300, addedG: 1 })).status).toBe(422)
    const both = await postCharging({ ...charging, addedG: 1, pressureKpa: 700 })
    expect(both.status).toBe(400)
    expect(both.body.data?.fieldErrors?.addedG).toBeDefined()
    expect((await new ApiClient().post('/api/calculations/charging', { ...charging, addedG: 1 })).status).toBe(401)
  })
})
