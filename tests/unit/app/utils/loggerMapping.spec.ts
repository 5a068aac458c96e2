import { describe, expect, it } from 'vitest'
import { LoggerMappingSchema } from '#shared/schemas/logger'
import { mappingForm, mappingOf, needsStage, unitsForQuantity } from '~/utils/loggerMapping'

const header = ['Zeit', 'Innen (°F)', 'Saugdruck', 'Notiz']

describe('the column-mapping form', () => {
  it('fills the form from a suggested mapping and leaves unmapped columns out', () => {
    const form = mappingForm(header, { time: { column: 'Zeit' }, columns: [{ column: 'Innen (°F)', quantity: 'cabinetTemperature', unit: 'F' }] }, 'low')
    expect(form.timeColumn).toBe('Zeit')
    expect(form.rows.find((r) => r.column === 'Innen (°F)')).toMatchObject({ include: true, quantity: 'cabinetTemperature', unit: 'F' })
    expect(form.rows.find((r) => r.column === 'Notiz')).toMatchObject({ include: false, quantity: 'other' })
  })

  it('turns the form back into a mapping the server schema accepts, with a stage where the quantity needs one', () => {
    const form = mappingForm(header, null, 'low')
    const suction = form.rows.find((r) => r.column === 'Saugdruck')!
    Object.assign(suction, { include: true, quantity: 'suctionPressure', unit: 'barg' })
    Object.assign(form.rows.find((r) => r.column === 'Innen (°F)')!, { include: true, quantity: 'cabinetTemperature', unit: 'F' })
    form.delimiter = ';'
    form.decimal = ','
    const mapping = mappingOf(form, -80)
    expect(mapping.columns).toEqual([
      { column: 'Innen (°F)', quantity: 'cabinetTemperature', unit: 'F' },
      { column: 'Saugdruck', quantity: 'suctionPressure', unit: 'barg', stage: 'low' },
    ])
    expect(LoggerMappingSchema.safeParse(mapping).success).toBe(true)
  })

  it('never maps the time column as a quantity too', () => {
    const form = mappingForm(header, null, 'single')
    form.rows.forEach((r) => (r.include = true))
    expect(mappingOf(form, null).columns.map((c) => c.column)).not.toContain('Zeit')
  })

  it('offers only the units that fit a quantity', () => {
    expect(unitsForQuantity('cabinetTemperature')).toEqual(['C', 'F', 'K'])
    expect(unitsForQuantity('compressorRunning')).toEqual(['bool'])
    expect(unitsForQuantity('suctionPressure')).toContain('psig')
    expect(needsStage('suctionPressure')).toBe(true)
    expect(needsStage('cabinetTemperature')).toBe(false)
  })

  it('maps a file without a header row by column position, as the server schema requires', () => {
    const positions = ['column 1', 'column 2', 'column 3']
    const form = mappingForm(positions, { hasHeader: false, time: { column: 0 }, columns: [] }, 'low')
    expect(form.byPosition).toBe(true)
    expect(form.timeColumn).toBe('column 1')
    Object.assign(form.rows.find((r) => r.column === 'column 3')!, { include: true, quantity: 'cabinetTemperature', unit: 'C' })
    Object.assign(form.rows.find((r) => r.column === 'column 2')!, { include: true, quantity: 'suctionPressure', unit: 'psig' })
    const mapping = mappingOf(form, null)
    expect(mapping.hasHeader).toBe(false)
    expect(mapping.time.column).toBe(0)
    expect(mapping.columns).toEqual([
      { column: 1, quantity: 'suctionPressure', unit: 'psig', stage: 'low' },
      { column: 2, quantity: 'cabinetTemperature', unit: 'C' },
    ])
    expect(LoggerMappingSchema.safeParse(mapping).success).toBe(true)
  })

  it('fills a remembered by-position mapping back into the form, time column included', () => {
    const positions = ['column 1', 'column 2', 'column 3']
    const form = mappingForm(positions, { hasHeader: false, time: { column: 2 }, columns: [{ column: 0, quantity: 'ambientTemperature', unit: 'F' }] }, 'single', true)
    expect(form.timeColumn).toBe('column 3')
    expect(form.rows.find((r) => r.position === 0)).toMatchObject({ include: true, quantity: 'ambientTemperature', unit: 'F' })
    expect(mappingOf(form, null).time.column).toBe(2)
  })

  it('keeps names for a file with a header', () => {
    const mapping = mappingOf(mappingForm(header, null, 'low'), null)
    expect(mapping.hasHeader).toBeUndefined()
    expect(mapping.time.column).toBe('Zeit')
  })
})
