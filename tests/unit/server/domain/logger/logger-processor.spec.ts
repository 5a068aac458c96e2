import { describe, expect, it } from 'vitest'
import { processLoggerCsv } from '#server/domain/logger/logger-processor'
import type { LoggerMappingInput } from '#shared/schemas/logger'
import { readingSchema, symptomSchema } from '#shared/schemas/diagnosis'
import { chunked, dmyTime, isoTime, pullDownSeries, stream } from './fixtures'

const cabinet = pullDownSeries({ fromC: 22, toC: -80, rateKPerHour: 30, stall: { levelC: -45, minutes: 180 } }, 10 * 60)
const f = (c: number) => ((c * 9) / 5 + 32).toFixed(2)

/** A clean comma-separated log: time, cabinet °C, cascade HX °C, room °C, compressor 1/0. */
function goodCsv(rows = cabinet.length): string {
  const lines = ['Time,Cabinet (°C),Cascade HX (°C),Room (°C),Compressor']
  for (let m = 0; m < rows; m++) lines.push(`${isoTime(m)},${cabinet[m]!.toFixed(2)},${(-30 - m / 60).toFixed(2)},21.5,1`)
  return `${lines.join('\n')}\n`
}
const goodMapping: LoggerMappingInput = {
  time: { column: 'Time' },
  columns: [
    { column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' },
    { column: 'Cascade HX (°C)', quantity: 'cascadeHxTemperature', unit: 'C' },
    { column: 'Room (°C)', quantity: 'ambientTemperature', unit: 'C' },
    { column: 'Compressor', quantity: 'compressorRunning', stage: 'low', unit: 'bool' },
  ],
  setpointC: -80,
}

describe('processLoggerCsv: a good file', () => {
  it('summarises every column, finds the known stall and offers readings and symptoms', async () => {
    const r = await processLoggerCsv(stream(goodCsv()), goodMapping)
    expect(r.status).toBe('ok')
    expect(r.rows).toMatchObject({ total: 601, data: 600, valid: 600, withErrors: 0 })
    expect(r.format).toMatchObject({ delimiter: ',', decimal: '.', headerRow: 1, timeFormat: 'iso', encoding: 'utf-8' })
    expect(r.span).toMatchObject({ startAt: Date.UTC(2025, 2, 1, 8), minutes: 599, typicalIntervalSeconds: 60, gaps: 0 })
    const cab = r.series.find((s) => s.quantity === 'cabinetTemperature')!
    expect(cab).toMatchObject({ count: 600, missing: 0, unit: 'C' })
    expect(cab.max).toBeCloseTo(21.5, 1)
    expect(cab.points.length).toBeGreaterThan(100)
    expect(r.stalls).toHaveLength(1)
    expect(r.stalls[0]!.levelC).toBeCloseTo(-45, 0)
    expect(r.stalls[0]!.running).toBe(true)
    expect(r.stalls[0]!.cascadeHxC).toBeLessThan(-30)
    expect(r.pullDowns[0]!.reached).toBe(true)
    expect(r.offered.symptoms.map((s) => s.symptom).sort()).toEqual(['not-cooling', 'slow-pulldown'])
    expect(r.offered.readings).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ quantity: 'cabinetTemperature', unit: 'C', at: Date.UTC(2025, 2, 1, 8) + 599 * 60_000 }),
        expect.objectContaining({ quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' }),
        expect.objectContaining({ quantity: 'setpointTemperature', value: -80 }),
        expect.objectContaining({ quantity: 'runtime', value: 599, unit: 'min', note: expect.stringMatching(/at least/) }),
      ]),
    )
    // What is offered must be accepted as it stands by a case's readings and symptoms.
    for (const { quantity, stage, value, unit } of r.offered.readings) expect(readingSchema.safeParse({ quantity, ...(stage ? { stage } : {}), value, unit }).success, quantity).toBe(true)
    for (const s of r.offered.symptoms) expect(symptomSchema.safeParse(s.symptom).success).toBe(true)
  })

  it('gives the same result however the bytes are cut into chunks', async () => {
    const whole = await processLoggerCsv(stream(goodCsv()), goodMapping)
    const bits = await processLoggerCsv(chunked(goodCsv(), 777), goodMapping)
    expect(bits.series.map((s) => [s.count, s.min, s.max])).toEqual(whole.series.map((s) => [s.count, s.min, s.max]))
    expect(bits.stalls).toEqual(whole.stalls)
    // "°" is two bytes in UTF-8: cut between them, it must still match the mapped header.
    const tiny = await processLoggerCsv(chunked(goodCsv(30), 3), goodMapping)
    expect(tiny.rows.valid).toBe(30)
  })

  it('reports progress and can be cancelled', async () => {
    const text = goodCsv() + Array.from({ length: 6000 }, (_, m) => `${isoTime(600 + m)},-80.00,-35.00,21.5,1`).join('\n')
    const seen: number[] = []
    await processLoggerCsv(chunked(text, 1000), goodMapping, { totalBytes: Buffer.byteLength(text), onProgress: (p) => seen.push(p.fraction!) })
    expect(seen.length).toBeGreaterThan(5)
    expect(seen.at(-1)).toBe(1)
    expect([...seen].sort((a, b) => a - b)).toEqual(seen)
    const controller = new AbortController()
    const run = processLoggerCsv(chunked(text, 1000), goodMapping, { totalBytes: Buffer.byteLength(text), onProgress: (p) => p.fraction! > 0.3 && controller.abort(), signal: controller.signal })
    await expect(run).rejects.toMatchObject({ name: 'AbortError' })
  })
})

describe('processLoggerCsv: odd files', () => {
  it('reads semicolons, decimal commas, °F, a preamble, day-first dates and Windows-1252 text', async () => {
    const lines = ['Logger: invented model LX-2', 'Serial;0000-DEMO', '', 'Datum;Innen \xb0F;Raum \xb0F']
    for (let m = 0; m < cabinet.length; m++) lines.push(`${dmyTime(m)};${f(cabinet[m]!).replace('.', ',')};${f(21.5).replace('.', ',')}`)
    const r = await processLoggerCsv(stream(Buffer.from(`${lines.join('\r\n')}\r\n\r\n`, 'latin1')), {
      time: { column: 'Datum' },
      columns: [
        { column: 'Innen °F', quantity: 'cabinetTemperature', unit: 'F' },
        { column: 'Raum °F', quantity: 'ambientTemperature', unit: 'F' },
      ],
      setpointC: -80,
    })
    expect(r.status).toBe('ok')
    expect(r.format).toMatchObject({ encoding: 'windows-1252', delimiter: ';', decimal: ',', headerRow: 4, timeFormat: 'day-month-year' })
    expect(r.rows).toMatchObject({ data: 600, valid: 600, empty: 1 })
    const cab = r.series[0]!
    expect(cab.min).toBeCloseTo(-80.2, 1) // converted from °F: (°F − 32) × 5/9 (definition of the scales)
    expect(r.stalls[0]!.levelC).toBeCloseTo(-45, 0)
    expect(r.warnings.join(' ')).toMatch(/day\/month or month\/day/)
  })

  it('reads quoted decimal commas in a comma-separated file', async () => {
    const lines = ['"Time","Cabinet"', ...Array.from({ length: 30 }, (_, m) => `"${isoTime(m)}","${cabinet[m]!.toFixed(1).replace('.', ',')}"`)]
    const r = await processLoggerCsv(stream(lines.join('\n')), { time: { column: 'Time' }, columns: [{ column: 'Cabinet', quantity: 'cabinetTemperature', unit: 'C' }] })
    expect(r.format).toMatchObject({ delimiter: ',', decimal: ',' })
    expect(r.rows.valid).toBe(30)
    expect(r.series[0]!.max).toBeCloseTo(21.5, 1)
  })

  it('reads cells that carry their unit, and refuses a unit that contradicts the mapping', async () => {
    const lines = ['Time;Cabinet;Room', ...Array.from({ length: 20 }, (_, m) => `${isoTime(m)};${cabinet[m]!.toFixed(1).replace('.', ',')} °C;${m === 7 ? '70 °F' : '21,5 °C'}`)]
    const r = await processLoggerCsv(stream(lines.join('\n')), { time: { column: 'Time' }, columns: [{ column: 'Cabinet', quantity: 'cabinetTemperature', unit: 'C' }, { column: 'Room', quantity: 'ambientTemperature', unit: 'C' }] })
    expect(r.series[0]!.count).toBe(20)
    expect(r.errors).toEqual([{ row: 9, column: 'Room', message: '"70 °F" is in F, but the mapping says C' }])
  })

  it('reads kelvin columns, elapsed minutes and separate date and time columns', async () => {
    const kelvin = ['min,T_cab_K']
    for (let m = 0; m < 300; m++) kelvin.push(`${m},${(cabinet[m]! + 273.15).toFixed(2)}`)
    const r = await processLoggerCsv(stream(kelvin.join('\n')), { time: { column: 'min', format: 'elapsed-min' }, columns: [{ column: 'T_cab_K', quantity: 'cabinetTemperature', unit: 'K' }], setpointC: -80 })
    expect(r.timeBase).toBe('elapsed')
    expect(r.series[0]!.max).toBeCloseTo(21.5, 1)
    expect(r.offered.readings[0]!.at).toBeNull()
    const split = ['Date\tTime\tT1']
    for (let m = 0; m < 120; m++) split.push(`${isoTime(m).slice(0, 10)}\t${isoTime(m).slice(11)}\t${cabinet[m]!.toFixed(1)}`)
    const s = await processLoggerCsv(stream(split.join('\n')), { time: { column: 'Date', timeOfDayColumn: 'Time' }, columns: [{ column: 'T1', quantity: 'cabinetTemperature', unit: 'C' }] })
    expect(s.format.delimiter).toBe('\t')
    expect(s.span!.minutes).toBe(119)
  })

  it('follows a logger clock that goes back one hour when daylight-saving time ends', async () => {
    // Local time, UTC+2 in summer: 02:00–02:59 is written twice on the night the clocks go back.
    const lines = ['Time,Cabinet']
    const local = (m: number) => isoTime(m, Date.UTC(2025, 9, 26, 1, 0))
    for (let m = 0; m < 120; m++) lines.push(`${local(m)},-80`) // 01:00 … 02:59 summer time
    for (let m = 60; m < 180; m++) lines.push(`${local(m)},-80`) // 02:00 … 03:59 winter time
    const r = await processLoggerCsv(stream(lines.join('\n')), { time: { column: 'Time', utcOffsetMinutes: 120 }, columns: [{ column: 'Cabinet', quantity: 'cabinetTemperature', unit: 'C' }] })
    expect(r.rows.withErrors).toBe(0)
    expect(r.span).toMatchObject({ startAt: Date.UTC(2025, 9, 25, 23, 0), minutes: 239 })
    expect(r.warnings.join(' ')).toMatch(/At row 122 the logger's clock went back one hour/)
  })

  it('takes columns by position in a file without a header', async () => {
    const rows = Array.from({ length: 60 }, (_, m) => `${isoTime(m)},${cabinet[m]!.toFixed(2)}`)
    const r = await processLoggerCsv(stream(rows.join('\n')), { hasHeader: false, time: { column: 0 }, columns: [{ column: 1, quantity: 'cabinetTemperature', unit: 'C' }] })
    expect(r.rows.valid).toBe(60)
    expect(r.series[0]!.column).toBe('column 2')
  })

  it('counts compressor short cycles and offers compressor-short-cycling', async () => {
    const lines = ['Time,Cabinet,Comp']
    for (let m = 0; m < 240; m++) lines.push(`${isoTime(m)},-80,${m % 6 < 2 ? 1 : 0}`) // 2 min on, 4 min off
    const r = await processLoggerCsv(stream(lines.join('\n')), {
      time: { column: 'Time' },
      columns: [
        { column: 'Cabinet', quantity: 'cabinetTemperature', unit: 'C' },
        { column: 'Comp', quantity: 'compressorRunning', stage: 'single', unit: 'bool' },
      ],
      setpointC: -80,
    })
    expect(r.compressor!.starts).toBe(39)
    expect(r.compressor!.shortCycles).toBe(39)
    expect(r.compressor!.runFraction).toBeCloseTo(1 / 3, 1)
    expect(r.offered.symptoms.map((s) => s.symptom)).toContain('compressor-short-cycling')
  })
})

describe('processLoggerCsv: broken files', () => {
  it('names the row and column of every bad cell and keeps the rest', async () => {
    const lines = goodCsv(50).trimEnd().split('\n')
    lines[5] = lines[5]!.replace(/,-?\d+\.\d+,/, ',abc,') // row 6: cabinet not a number
    lines[9] = `${isoTime(3)},-1.00,-30.00,21.5,1` // row 10: time goes back
    lines[12] = lines[12]!.replace('21.5', '-300') // row 13: room below absolute zero
    lines[20] = '2025-03-01 08:19:00,-1.0' // row 21: too few fields
    lines[25] = lines[25]!.replace(/^[^,]+/, '2025-02-30 08:24:00') // row 26: no such date
    lines[30] = lines[30]!.replace(/,1$/, ',maybe') // row 31: compressor state unreadable
    const r = await processLoggerCsv(stream(lines.join('\n')), goodMapping)
    expect(r.status).toBe('ok-with-errors')
    expect(r.errors).toEqual([
      { row: 6, column: 'Cabinet (°C)', message: expect.stringMatching(/"abc" is not a number/) },
      { row: 10, column: 'Time', message: expect.stringMatching(/time goes back/) },
      { row: 13, column: 'Room (°C)', message: expect.stringMatching(/below absolute zero/) },
      { row: 21, column: null, message: expect.stringMatching(/has 2 fields, 5 or more expected/) },
      { row: 26, column: 'Time', message: expect.stringMatching(/not a valid calendar date/) },
      { row: 31, column: 'Compressor', message: expect.stringMatching(/not an on\/off state/) },
    ])
    expect(r.rows).toMatchObject({ data: 50, valid: 47, withErrors: 6 })
  })

  it('lists the first 100 problems and counts the rest', async () => {
    const lines = goodCsv(600).trimEnd().split('\n').map((l, i) => (i > 0 && i <= 110 ? l.replace(/,1$/, ',?') : l))
    const r = await processLoggerCsv(stream(lines.join('\n')), goodMapping)
    expect(r.status).toBe('ok-with-errors') // 110 of 600 rows: under the 20 % at which a file fails
    expect(r.errors).toHaveLength(100)
    expect(r.errors[99]!.row).toBe(101)
    expect(r.warnings.join(' ')).toMatch(/110 problems in all; the first 100 are listed/)
  })

  it('fails a file whose rows are mostly unreadable, saying what to check', async () => {
    const semicolons = goodCsv(50).replace(/,/g, ';').replace(/\./g, ',')
    const r = await processLoggerCsv(stream(semicolons), { ...goodMapping, delimiter: ';', decimal: '.' })
    expect(r.status).toBe('failed')
    expect(r.failure).toMatch(/check the delimiter, decimal mark/)
    expect(r.errors[0]).toMatchObject({ row: 2, column: 'Cabinet (°C)' })
  })

  it('fails with a clear message for a missing column, an empty file, a header without data and a binary file', async () => {
    const missing = await processLoggerCsv(stream(goodCsv(5)), { ...goodMapping, columns: [{ column: 'Freezer', quantity: 'cabinetTemperature', unit: 'C' }] })
    expect(missing).toMatchObject({ status: 'failed' })
    expect(missing.failure).toMatch(/No header row with the columns "Time", "Freezer"/)
    expect(missing.failure).toMatch(/The first row with columns reads: "Time", "Cabinet \(°C\)"/)
    expect((await processLoggerCsv(stream(''), goodMapping)).failure).toBe('The file is empty.')
    expect((await processLoggerCsv(stream('Time,Cabinet (°C),Cascade HX (°C),Room (°C),Compressor\n'), goodMapping)).failure).toMatch(/no data rows/)
    expect((await processLoggerCsv(stream(Buffer.from([0x50, 0x4b, 3, 4, 0, 0])), goodMapping)).failure).toMatch(/not a text CSV file/)
  })

  it('refuses a mapping that does not fit the quantity', async () => {
    await expect(processLoggerCsv(stream(goodCsv(5)), { ...goodMapping, columns: [{ column: 'Room (°C)', quantity: 'ambientTemperature', unit: 'psig' }] })).rejects.toThrow(/does not fit ambientTemperature/)
  })
})
