import { describe, expect, it } from 'vitest'
import { guessTimeFormat, readNumber, readState, readTime, splitUnit, timeReader } from '#server/domain/logger/cell-values'

describe('readNumber', () => {
  it('reads decimal points and decimal commas, and leaves blanks as missing', () => {
    expect(readNumber('-79.85', '.')).toEqual({ ok: true, value: -79.85 })
    expect(readNumber(' -79,85 ', ',')).toEqual({ ok: true, value: -79.85 })
    expect(readNumber('\u221280,5', ',')).toEqual({ ok: true, value: -80.5 })
    expect(readNumber('', '.')).toEqual({ ok: true, value: null })
    expect(readNumber('NaN', '.')).toEqual({ ok: true, value: null })
    expect(readNumber('1.5e-3', '.')).toEqual({ ok: true, value: 0.0015 })
    expect(readNumber('+7', '.')).toEqual({ ok: true, value: 7 })
    // the character scan gives the same double as Number() on the same text
    for (const t of ['-79.853', '0.1', '123456.789', '-0.0001']) expect(readNumber(t, '.')).toEqual({ ok: true, value: Number(t) })
    for (const t of ['-79,853', '0,1']) expect(readNumber(t, ',')).toEqual({ ok: true, value: Number(t.replace(',', '.')) })
  })
  it('explains a bad number and hints at a decimal comma', () => {
    const r = readNumber('-79,85', '.')
    expect(r.ok).toBe(false)
    expect(!r.ok && r.reason).toMatch(/decimal comma/)
    expect(readNumber('abc', '.').ok).toBe(false)
    expect(readNumber('1.234,5', ',').ok).toBe(false)
    for (const t of ['0x10', 'Infinity', '1e', '--5', '5-', '1,2,3']) expect(readNumber(t, '.').ok, t).toBe(false)
  })
})

describe('splitUnit', () => {
  it('separates a unit written into the cell', () => {
    expect(splitUnit('-79,8 °C')).toEqual({ number: '-79,8', unit: 'C' })
    expect(splitUnit('-112.4°F')).toEqual({ number: '-112.4', unit: 'F' })
    expect(splitUnit('193.2 K')).toEqual({ number: '193.2', unit: 'K' })
    expect(splitUnit('15 psig')).toEqual({ number: '15', unit: 'psig' })
    expect(splitUnit('3.4 A')).toEqual({ number: '3.4', unit: 'a' })
    expect(splitUnit('-79.8')).toBeNull()
  })
})

describe('readState', () => {
  it('reads the usual on/off spellings', () => {
    for (const on of ['1', 'ON', 'true', 'Run', 'ein']) expect(readState(on)).toEqual({ ok: true, value: 1 })
    for (const off of ['0', 'off', 'FALSE', 'stop', 'aus']) expect(readState(off)).toEqual({ ok: true, value: 0 })
    expect(readState('maybe').ok).toBe(false)
  })
})

describe('readTime', () => {
  const utc = Date.UTC(2025, 2, 31, 14, 5, 0)
  it('reads ISO dates with and without a zone', () => {
    expect(readTime('2025-03-31 14:05:00', 'iso', 0)).toEqual({ ok: true, value: utc })
    expect(readTime('2025-03-31T16:05:00+02:00', 'iso', 0)).toEqual({ ok: true, value: utc })
    expect(readTime('2025-03-31 15:05:00', 'iso', 60)).toEqual({ ok: true, value: utc }) // logger clock on UTC+1
    expect(readTime('2025-03-31T14:05:00.250Z', 'iso', 0)).toEqual({ ok: true, value: utc + 250 })
  })
  it('reads day-first and month-first dates, 2-digit years and AM/PM', () => {
    expect(readTime('31.03.2025 14:05', 'day-month-year', 0)).toEqual({ ok: true, value: utc })
    expect(readTime('31/03/25 14:05:00', 'day-month-year', 0)).toEqual({ ok: true, value: utc })
    expect(readTime('03/31/2025 2:05 PM', 'month-day-year', 0)).toEqual({ ok: true, value: utc })
    expect(readTime('03/31/2025 12:05 AM', 'month-day-year', 0)).toEqual({ ok: true, value: Date.UTC(2025, 2, 31, 0, 5) })
  })
  it('reads epoch, spreadsheet serials and elapsed time', () => {
    expect(readTime(String(utc / 1000), 'epoch-s', 0)).toEqual({ ok: true, value: utc })
    expect(readTime(String(utc), 'epoch-ms', 0)).toEqual({ ok: true, value: utc })
    // 45 747 is 2025-03-31 in the 1900 date system (days since 1899-12-30); 14:05 is 0.586805… of a day.
    expect(readTime(String(45747 + (14 * 60 + 5) / 1440), 'excel-serial', 0)).toEqual({ ok: true, value: utc })
    expect(readTime('90', 'elapsed-min', 0)).toEqual({ ok: true, value: 90 * 60_000 })
    expect(readTime('1,5', 'elapsed-h', 0)).toEqual({ ok: true, value: 90 * 60_000 })
  })
  it('refuses impossible dates and says what was expected', () => {
    expect(readTime('2025-02-30 10:00:00', 'iso', 0).ok).toBe(false)
    expect(readTime('31.13.2025 10:00', 'day-month-year', 0).ok).toBe(false)
    const r = readTime('yesterday', 'iso', 0)
    expect(!r.ok && r.reason).toMatch(/not a date and time like 2025-03-01 14:05:00/)
  })
})

describe('timeReader', () => {
  it('reads the fixed layouts digit by digit exactly as readTime does, across date changes', () => {
    const iso = timeReader('iso', 60)
    const dmy = timeReader('day-month-year', 0)
    for (const t of ['2025-03-31 23:59:59', '2025-04-01 00:00:00', '2025-04-01T00:00', '2024-02-29 12:00:00', '2025-03-31 14:05:00+02:00']) {
      expect(iso(t), t).toEqual(readTime(t, 'iso', 60))
    }
    for (const t of ['31.03.2025 23:59:59', '01.04.2025 00:00', '1.4.2025 00:00']) expect(dmy(t), t).toEqual(readTime(t, 'day-month-year', 0))
    expect(iso('2025-02-29 10:00:00').ok).toBe(false) // 2025 is not a leap year
    expect(iso('2025-13-01 10:00:00').ok).toBe(false)
    expect(iso('2025-03-01 24:00:00').ok).toBe(false)
  })
})

describe('guessTimeFormat', () => {
  it('recognises the common layouts', () => {
    expect(guessTimeFormat(['2025-03-01 08:00:00', '2025-03-01 08:01:00']).format).toBe('iso')
    expect(guessTimeFormat(['12.03.2025 08:00', '13.03.2025 08:00'])).toEqual({ format: 'day-month-year', assumption: null })
    expect(guessTimeFormat(['03/12/2025 08:00', '03/13/2025 08:00'])).toEqual({ format: 'month-day-year', assumption: null })
    expect(guessTimeFormat(['1740816000', '1740816060']).format).toBe('epoch-s')
    expect(guessTimeFormat(['1740816000000']).format).toBe('epoch-ms')
  })
  it('says when it had to assume', () => {
    const g = guessTimeFormat(['01/03/2025 08:00', '01/03/2025 08:01'])
    expect(g.format).toBe('day-month-year')
    expect(g.assumption).toMatch(/day\/month or month\/day/)
    expect(guessTimeFormat(['0', '60', '120']).assumption).toMatch(/seconds since the start/)
  })
})
