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
    expect(StandingPressureBodySchema.parse({ ...base, pressureKpa: 1992 })).toMatchObject({ mode: 'pressure', pressureKpa: 1992 })
    expect(StandingPressureBodySchema.parse({ designation: 'R170', ambientC: 25, referencePressureKpa: 1992, referenceAmbientC: 20 })).toMatchObject({ mode: 'shift' })
  })

  it('names the fields at fault', () => {
    expect(fields(StandingPressureBodySchema.safeParse(base))).toEqual(['chargeG', 'pressureKpa'])
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
