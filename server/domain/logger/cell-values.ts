/**
 * Reading the cells of a logger file: numbers with a decimal point or comma, on/off states, and the
 * many ways loggers write a time. Each reader returns a value or a short reason, never throws, because
 * a bad cell is reported with its row and column and the file goes on.
 */
import type { TimeFormat } from '#shared/types/logger'

export type Cell<T> = { ok: true; value: T } | { ok: false; reason: string }
const bad = (reason: string): { ok: false; reason: string } => ({ ok: false, reason })

const POINT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/
const COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/

/** A number written with `decimal` as its decimal mark; '' is missing (null). */
export function readNumber(text: string, decimal: '.' | ','): Cell<number | null> {
  let s = text.trim()
  if (s === '' || s === '-' || /^(n\/?a|nan|null|---?)$/i.test(s)) return { ok: true, value: null }
  s = s.replace(/\u2212/g, '-').replace(/^\+/, '')
  if (decimal === ',') {
    if (!COMMA_NUMBER.test(s)) return bad(`"${text.trim()}" is not a number with a decimal comma`)
    s = s.replace(',', '.')
  } else if (!POINT_NUMBER.test(s)) {
    return bad(`"${text.trim()}" is not a number${/^[+-]?\d+,\d+$/.test(s) ? ' (a decimal comma? set the decimal mark to ",")' : ''}`)
  }
  const value = Number(s)
  return Number.isFinite(value) ? { ok: true, value } : bad(`"${text.trim()}" is out of range`)
}

const ON = /^(1|on|true|yes|run|running|ein|an|y)$/i
const OFF = /^(0|off|false|no|stop|stopped|aus|n)$/i

/** A running state: 1/0, on/off, true/false, run/stop (and their German forms); '' is missing. */
export function readState(text: string): Cell<number | null> {
  const s = text.trim()
  if (s === '') return { ok: true, value: null }
  if (ON.test(s)) return { ok: true, value: 1 }
  if (OFF.test(s)) return { ok: true, value: 0 }
  const n = Number(s.replace(',', '.'))
  if (Number.isFinite(n)) return { ok: true, value: n > 0 ? 1 : 0 }
  return bad(`"${s}" is not an on/off state (use 1/0, on/off or true/false)`)
}

const ISO = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,6}))?)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i
const DMY = /^(\d{1,2})[./-](\d{1,2})[./-](\d{2,4})(?:[ T,]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,6}))?)?\s*([AaPp][Mm])?)?$/
const EXCEL_EPOCH_MS = Date.UTC(1899, 11, 30)
const MS_PER_DAY = 86_400_000

function civil(y: number, mo: number, d: number, h: number, mi: number, s: number, frac: string | undefined, offsetMinutes: number): Cell<number> {
  if (mo < 1 || mo > 12 || d < 1 || d > 31 || h > 23 || mi > 59 || s > 60) return bad('is not a valid date and time')
  const ms = frac ? Math.round(Number(`0.${frac}`) * 1000) : 0
  const t = Date.UTC(y, mo - 1, d, h, mi, s, ms)
  if (new Date(t).getUTCDate() !== d) return bad('is not a valid calendar date')
  return { ok: true, value: t - offsetMinutes * 60_000 }
}

function zoneMinutes(zone: string): number {
  if (/^z$/i.test(zone)) return 0
  const m = /^([+-])(\d{2}):?(\d{2})$/.exec(zone)!
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]))
}

/**
 * A time in ms: absolute (since 1970, UTC) for dates, relative (since the log start) for elapsed
 * formats. `offsetMinutes` is the logger clock's offset from UTC, used when the text carries no zone.
 */
export function readTime(text: string, format: Exclude<TimeFormat, 'auto'>, offsetMinutes: number): Cell<number> {
  const s = text.trim()
  if (s === '') return bad('is empty')
  const fail = (what: string) => bad(`"${s}" ${what}`)
  switch (format) {
    case 'iso': {
      const m = ISO.exec(s)
      if (!m) return fail('is not a date and time like 2025-03-01 14:05:00')
      const r = civil(+m[1]!, +m[2]!, +m[3]!, +(m[4] ?? 0), +(m[5] ?? 0), +(m[6] ?? 0), m[7], m[8] ? zoneMinutes(m[8]) : offsetMinutes)
      return r.ok ? r : fail(r.reason)
    }
    case 'day-month-year':
    case 'month-day-year': {
      const m = DMY.exec(s)
      if (!m) return fail(`is not a date like ${format === 'day-month-year' ? '31.03.2025 14:05' : '03/31/2025 2:05 PM'}`)
      let [a, b] = [+m[1]!, +m[2]!]
      if (format === 'month-day-year') [a, b] = [b, a]
      let y = +m[3]!
      if (m[3]!.length === 2) y += 2000
      else if (m[3]!.length !== 4) return fail('has a year that is neither 2 nor 4 digits')
      let h = +(m[4] ?? 0)
      const ampm = m[8]?.toLowerCase()
      if (ampm) {
        if (h < 1 || h > 12) return fail('has an hour outside 1–12 with AM/PM')
        h = (h % 12) + (ampm === 'pm' ? 12 : 0)
      }
      const r = civil(y, b, a, h, +(m[5] ?? 0), +(m[6] ?? 0), m[7], offsetMinutes)
      return r.ok ? r : fail(r.reason)
    }
    default: {
      const n = Number(s.replace(',', '.'))
      if (!Number.isFinite(n)) return fail('is not a number of seconds, minutes or days')
      if (format === 'epoch-s') return { ok: true, value: Math.round(n * 1000) }
      if (format === 'epoch-ms') return { ok: true, value: Math.round(n) }
      if (format === 'excel-serial') return { ok: true, value: Math.round(EXCEL_EPOCH_MS + n * MS_PER_DAY - offsetMinutes * 60_000) }
      if (n < 0) return fail('is a negative elapsed time')
      const factor = format === 'elapsed-s' ? 1000 : format === 'elapsed-min' ? 60_000 : 3_600_000
      return { ok: true, value: Math.round(n * factor) }
    }
  }
}

/** True for formats that count from the log's start rather than a calendar date. */
export const isElapsed = (f: TimeFormat) => f === 'elapsed-s' || f === 'elapsed-min' || f === 'elapsed-h'

/**
 * Guesses the time format from sample cells: ISO dates, day-first or month-first dates (decided by a
 * day above 12 in either place; day-first when nothing decides it), epoch seconds or milliseconds,
 * or elapsed seconds for small plain numbers. The second value explains an assumption, if one was made.
 */
export function guessTimeFormat(samples: readonly string[]): { format: Exclude<TimeFormat, 'auto'>; assumption: string | null } {
  const cells = samples.map((s) => s.trim()).filter(Boolean)
  if (!cells.length) return { format: 'iso', assumption: 'No time values to look at; assumed ISO dates.' }
  if (cells.every((c) => ISO.test(c))) return { format: 'iso', assumption: null }
  if (cells.every((c) => DMY.test(c))) {
    const parts = cells.map((c) => DMY.exec(c)!)
    if (parts.some((m) => +m[1]! > 12)) return { format: 'day-month-year', assumption: null }
    if (parts.some((m) => +m[2]! > 12)) return { format: 'month-day-year', assumption: null }
    if (parts.some((m) => m[8])) return { format: 'month-day-year', assumption: 'Dates with AM/PM read as month/day/year; set the time format if that is wrong.' }
    return { format: 'day-month-year', assumption: `Dates such as "${cells[0]}" could be day/month or month/day; read as day/month/year. Set the time format in the mapping if that is wrong.` }
  }
  const numbers = cells.map((c) => Number(c.replace(',', '.')))
  if (numbers.every(Number.isFinite)) {
    const first = numbers[0]!
    if (first > 1e11) return { format: 'epoch-ms', assumption: null }
    if (first > 1e8) return { format: 'epoch-s', assumption: null }
    if (first > 20_000 && first < 80_000 && numbers.some((n) => !Number.isInteger(n))) return { format: 'excel-serial', assumption: 'Fractional numbers around 45 000 read as spreadsheet date serials.' }
    return { format: 'elapsed-s', assumption: 'Plain numbers read as seconds since the start of the log; set the time format to minutes or hours if that is wrong.' }
  }
  return { format: 'iso', assumption: null }
}
