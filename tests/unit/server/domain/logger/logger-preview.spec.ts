import { describe, expect, it } from 'vitest'
import { previewLoggerCsv } from '#server/domain/logger/logger-preview'
import { processLoggerCsv } from '#server/domain/logger/logger-processor'
import { dmyTime, isoTime, pullDownSeries, stream } from './fixtures'

const cabinet = pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30, stall: { levelC: -45, minutes: 180 } }, 10 * 60)

describe('previewLoggerCsv', () => {
  it('finds the header under a preamble and suggests a mapping that the analysis accepts', async () => {
    const lines = ['Logger: invented model LX-2', 'Serial;0000-DEMO', '', 'Datum;Innen \xb0F;Raum \xb0F;Tür']
    for (let m = 0; m < cabinet.length; m++) lines.push(`${dmyTime(m)};${(((cabinet[m]! * 9) / 5) + 32).toFixed(2).replace('.', ',')};70,7;0`)
    const file = Buffer.from(lines.join('\r\n'), 'latin1')
    const p = await previewLoggerCsv(stream(file), 5)
    expect(p).toMatchObject({ failure: null, encoding: 'windows-1252', delimiter: ';', decimal: ',', headerRow: 4, header: ['Datum', 'Innen °F', 'Raum °F', 'Tür'] })
    expect(p.rows).toHaveLength(5)
    expect(p.suggestion.mapping.time).toEqual({ column: 'Datum' })
    expect(p.suggestion.mapping.columns).toEqual([
      { column: 'Innen °F', quantity: 'cabinetTemperature', unit: 'F' },
      { column: 'Raum °F', quantity: 'ambientTemperature', unit: 'F' },
    ])
    expect(p.suggestion.unmapped).toEqual(['Tür'])
    const r = await processLoggerCsv(stream(file), { ...p.suggestion.mapping, setpointC: -80 })
    expect(r.status).toBe('ok')
    expect(r.stalls[0]!.levelC).toBeCloseTo(-45, 0)
  })

  it('counts decimal-comma figures as data when only two of three columns are figures', async () => {
    const lines = ['Logger export', 'Datum Zeit;Innen (°F);Raum (°F)']
    for (let m = 0; m < 30; m++) lines.push(`${dmyTime(m)};${(((cabinet[m]! * 9) / 5) + 32).toFixed(2).replace('.', ',')};69,80`)
    const p = await previewLoggerCsv(stream(lines.join('\r\n')))
    expect(p).toMatchObject({ failure: null, delimiter: ';', decimal: ',', headerRow: 2, header: ['Datum Zeit', 'Innen (°F)', 'Raum (°F)'] })
  })

  it('notices a file without a header', async () => {
    const p = await previewLoggerCsv(stream(Array.from({ length: 10 }, (_, m) => `${isoTime(m)},-80.1,21.0`).join('\n')))
    expect(p).toMatchObject({ headerRow: null, header: ['column 1', 'column 2', 'column 3'] })
    expect(p.suggestion.mapping.hasHeader).toBe(false)
  })

  it('says so for an empty, binary or non-tabular file', async () => {
    expect((await previewLoggerCsv(stream(''))).failure).toBe('The file is empty.')
    expect((await previewLoggerCsv(stream(Buffer.from([0x50, 0x4b, 3, 4, 0])))).failure).toMatch(/not a text CSV/)
    expect((await previewLoggerCsv(stream('Dear customer,\nplease find the log attached.\nRegards\n'))).failure).toMatch(/No run of data rows/)
  })
})
