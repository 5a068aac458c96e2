import { describe, expect, it } from 'vitest'
import { LoggerMappingSchema } from '#shared/schemas/logger'
import { suggestMapping } from '#server/domain/logger/suggest-mapping'

describe('suggestMapping', () => {
  it('maps an English cascade-freezer header with units in it', () => {
    const s = suggestMapping(['Timestamp', 'Cabinet (°C)', 'Cascade HX (°C)', 'Room °F', 'Low stage compressor', 'Low suction pressure (psig)', 'Door'], [], 'low')
    expect(s.mapping.time).toEqual({ column: 'Timestamp' })
    expect(s.mapping.columns).toEqual([
      { column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' },
      { column: 'Cascade HX (°C)', quantity: 'cascadeHxTemperature', unit: 'C' },
      { column: 'Room °F', quantity: 'ambientTemperature', unit: 'F' },
      { column: 'Low stage compressor', quantity: 'compressorRunning', stage: 'low', unit: 'bool' },
      { column: 'Low suction pressure (psig)', quantity: 'suctionPressure', stage: 'low', unit: 'psig' },
    ])
    expect(s.unmapped).toEqual(['Door'])
    expect(LoggerMappingSchema.safeParse(s.mapping).success).toBe(true)
  })

  it('maps German headers with separate date and time, and reads kelvin from the values', () => {
    const s = suggestMapping(['Datum', 'Uhrzeit', 'Innenraum', 'Raum'], [['01.03.2025', '08:00', '195.2', '294.6']])
    expect(s.mapping.time).toEqual({ column: 'Datum', timeOfDayColumn: 'Uhrzeit' })
    expect(s.mapping.columns.map((c) => [c.quantity, c.unit])).toEqual([['cabinetTemperature', 'K'], ['ambientTemperature', 'K']])
    expect(s.notes.join(' ')).toMatch(/kelvin assumed/)
  })

  it('takes the unit from the cells when they carry it', () => {
    const s = suggestMapping(['Time', 'Chamber'], [['2025-03-01 08:00', '-112,0 °F']])
    expect(s.mapping.columns).toEqual([{ column: 'Chamber', quantity: 'cabinetTemperature', unit: 'F' }])
  })

  it('says when it found no time or cabinet column', () => {
    const s = suggestMapping(['A', 'B'])
    expect(s.notes.join(' ')).toMatch(/No column looks like a time/)
    expect(s.notes.join(' ')).toMatch(/No cabinet temperature column/)
  })
})
