import { describe, expect, it } from 'vitest'
import { SaturationQuerySchema, StandingPressureBodySchema, MeasurementConversionQuerySchema } from '#shared/schemas/properties'

const fields = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => (r.error?.issues ?? []).map((i) => i.path.join('.'))

describe('SaturationQuerySchema', () => {
  it('takes exactly one of the starting points', () => {
    expect(SaturationQuerySchema.parse({ temperatureC: '-80' })).toEqual({ by: 'temperature', temperatureC: -80 })
    expect(SaturationQuerySchema.parse({ pressureKpa: '120' })).toEqual({ by: 'pressure', pressureKpa: 120 })
    expect(SaturationQuerySchema.parse({ pressure: '15', unit: 'psig' })).toEqual({ by: 'pressure', value: 15, unit: 'psig' })
    expect(SaturationQuerySchema.parse({ temperature: '-112', unit: 'F' })).toEqual({ by: 'temperature', value: -112, unit: 'F' })
    expect(fields(SaturationQuerySchema.safeParse({}))).toEqual(['temperatureC', 'pressureKpa'])
    expect(fields(SaturationQuerySchema.safeParse({ temperatureC: '1', pressureKpa: '2' }))).toEqual(['temperatureC', 'pressureKpa'])
  })

  it('reads gauge units against the altitude or a given atmosphere, not both', () => {
    expect(SaturationQuerySchema.parse({ pressure: '15', unit: 'psig', altitudeM: '2000' })).toEqual({ by: 'pressure', value: 15, unit: 'psig', altitudeM: 2000 })
    expect(SaturationQuerySchema.parse({ pressure: '500', unit: 'micron' })).toEqual({ by: 'pressure', value: 500, unit: 'micron' })
    expect(fields(SaturationQuerySchema.safeParse({ pressure: '15', unit: 'psig', altitudeM: '2000', atmosphericKpa: '80' }))).toEqual(['altitudeM'])
    expect(fields(SaturationQuerySchema.safeParse({ pressure: '15', unit: 'psig', altitudeM: '12000' }))).toEqual(['altitudeM'])
  })

  it('refuses empty, non-numeric and repeated values, and a unit of the wrong kind', () => {
    for (const q of [{ temperatureC: '' }, { temperatureC: 'x' }, { temperatureC: ['1', '2'] }, { pressure: '1', unit: 'C' }, { pressure: '1' }, { temperatureC: '1e999' }]) {
      expect(SaturationQuerySchema.safeParse(q).success, JSON.stringify(q)).toBe(false)
    }
  })
})

describe('StandingPressureBodySchema', () => {
  const base = { designation: 'R170', ambientC: 20, volumeL: 10 }
  it('resolves the three modes', () => {
    expect(StandingPressureBodySchema.parse({ ...base, chargeG: 300 })).toMatchObject({ mode: 'charge', chargeG: 300 })
    expect(StandingPressureBodySchema.parse({ ...base, pressureKpa: 1992 })).toMatchObject({ mode: 'pressure', pressure: { kpa: 1992 } })
    expect(StandingPressureBodySchema.parse({ designation: 'R170', ambientC: 25, referencePressureKpa: 1992, referenceAmbientC: 20 })).toMatchObject({ mode: 'shift' })
  })

  it('takes a gauge pressure with its unit and altitude, and a design pressure', () => {
    const r = StandingPressureBodySchema.parse({ ...base, pressure: 100, unit: 'psig', altitudeM: 1500, designPressure: 25, designPressureKpa: undefined })
    expect(r).toMatchObject({ mode: 'pressure', pressure: { value: 100, unit: 'psig', atmosphericKpa: expect.closeTo(84.56, 2) }, designPressure: { value: 25, unit: 'psig' } })
    expect(r.display).toEqual({ unit: 'psig', atmosphericKpa: expect.closeTo(84.56, 2) })
    expect(StandingPressureBodySchema.parse({ ...base, chargeG: 1, designPressureKpa: 2600 })).toMatchObject({ designPressure: { kpa: 2600 } })
  })

  it('names the fields at fault', () => {
    expect(fields(StandingPressureBodySchema.safeParse(base))).toEqual(['chargeG', 'pressureKpa'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, pressure: 100 }))).toEqual(['unit'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, pressure: 100, pressureKpa: 200, unit: 'psig' }))).toEqual(['pressure'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, chargeG: 1, pressure: 100, unit: 'psig' }))).toEqual(['chargeG', 'pressure'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, pressure: 100, unit: 'F' }))).toEqual(['unit'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, chargeG: 1, pressureKpa: 2 }))).toEqual(['chargeG', 'pressureKpa'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, volumeL: 0, chargeG: 1 }))).toEqual(['volumeL'])
    expect(fields(StandingPressureBodySchema.safeParse({ designation: 'R170', ambientC: 20, chargeG: 1 }))).toEqual(['volumeL'])
    expect(fields(StandingPressureBodySchema.safeParse({ ...base, chargeG: -1 }))).toEqual(['chargeG'])
    expect(fields(StandingPressureBodySchema.safeParse({ designation: 'R170', ambientC: 20, referenceAmbientC: 20 }))).toEqual(['referencePressureKpa'])
  })
})

describe('MeasurementConversionQuerySchema', () => {
  it('accepts one reading with two units of the same kind', () => {
    expect(MeasurementConversionQuerySchema.parse({ value: '15', from: 'psig', to: 'kPa' })).toEqual({ value: 15, from: 'psig', to: 'kPa' })
    expect(fields(MeasurementConversionQuerySchema.safeParse({ value: '15', from: 'psig', to: 'C' }))).toEqual(['to'])
    expect(fields(MeasurementConversionQuerySchema.safeParse({ value: '15', from: 'psig', to: 'kPa', atmosphericKpa: '100', altitudeM: '10' }))).toEqual(['altitudeM'])
  })
})
