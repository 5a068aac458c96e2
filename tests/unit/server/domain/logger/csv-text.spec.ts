import { describe, expect, it } from 'vitest'
import { LoggerTextDecoder, detectDecimal, detectDelimiter, findHeaderRow, headerKey } from '#server/domain/logger/csv-text'
import { BadInputError } from '#server/domain/errors'
import { stream } from './fixtures'

async function decode(buf: Buffer) {
  const d = new LoggerTextDecoder()
  let text = ''
  for await (const chunk of stream(buf).pipe(d)) text += chunk
  return { text, encoding: d.encoding, bytes: d.bytesRead }
}

describe('LoggerTextDecoder', () => {
  it('reads UTF-8 and strips its byte-order mark', async () => {
    const r = await decode(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('Zeit;Temp °C\n', 'utf8')]))
    expect(r).toMatchObject({ text: 'Zeit;Temp °C\n', encoding: 'utf-8' })
  })
  it('falls back to Windows-1252 for "°" written by older loggers', async () => {
    const r = await decode(Buffer.from('Time;Cabinet \xb0C\n', 'latin1'))
    expect(r).toMatchObject({ text: 'Time;Cabinet °C\n', encoding: 'windows-1252' })
  })
  it('reads UTF-16 with a byte-order mark (spreadsheet "Unicode text")', async () => {
    const r = await decode(Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Time\tT1\n', 'utf16le')]))
    expect(r).toMatchObject({ text: 'Time\tT1\n', encoding: 'utf-16le' })
  })
  it('refuses binary files', async () => {
    await expect(decode(Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 0]))).rejects.toThrow(BadInputError)
  })
})

describe('detectDelimiter and detectDecimal', () => {
  it('prefers the semicolon when decimal commas also split lines evenly', () => {
    const lines = ['Time;Cabinet;Ambient', '2025-03-01 08:00;-79,8;21,3', '2025-03-01 08:01;-79,9;21,4']
    expect(detectDelimiter(lines)).toBe(';')
    expect(detectDecimal([['-79,8', '21,3'], ['-79,9', '21,4']])).toBe(',')
  })
  it('finds commas and tabs, and ignores a preamble', () => {
    expect(detectDelimiter(['Logger model X-9; serial 1', 'Time,T1,T2', '1,2,3', '4,5,6'])).toBe(',')
    expect(detectDelimiter(['Time\tT1', '1\t2'])).toBe('\t')
    expect(detectDecimal([['-79.8', '21.3']])).toBe('.')
    expect(detectDelimiter(['sep=;', 'Time;T1', '1;2,5'])).toBe(';') // spreadsheet exports declare it
  })
})

describe('findHeaderRow', () => {
  it('finds the row naming every mapped column, however "°" was encoded', () => {
    const rows = [['Logger: invented model'], ['Serial', '0000'], ['Time', 'Cabinet \uFFFDC', 'Room °C'], ['2025-03-01', '-80', '21']]
    expect(findHeaderRow(rows, ['time', 'cabinet °C'])).toBe(2)
    expect(findHeaderRow(rows, ['Time', 'Missing'])).toBe(-1)
    expect(headerKey('  Cabinet   Â°C ')).toBe('cabinet °c')
  })
})
