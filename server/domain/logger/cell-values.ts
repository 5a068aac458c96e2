/**
 * Reading the cells of a logger file: numbers with a decimal point or comma, on/off states, and the
 * many ways loggers write a time. Each reader returns a value or a short reason, never throws, because
 * a bad cell is reported with its row and column and the file goes on.
 */
import type { TimeFormat } from '#shared/types/logger'

export type Cell<T> = { ok: true; value: T } | { ok: false; reason: string }
const bad = (reason: string): { ok: false; reason: string } => ({ ok: false, reason })

const MISSING_WORDS = /^(n\/?a|nan|null|---?)$/i
const MINUS = 0x2212

/**
 * A number written with `decimal` as its decimal mark; '' is missing (null). A character scan checks
 * the form (sign, digits, one decimal mark, optional exponent) before Number() reads it, which is far
 * quicker than regular expressions on a million-row file and as exact.
 */
export function readNumber(text: string, decimal: '.' | ','): Cell<number | null> {
  const mark = decimal.charCodeAt(0)
  let i = 0
  let n = text.length
  while (i < n && text.charCodeAt(i) <= 32) i++
  while (n > i && text.charCodeAt(n - 1) <= 32) n--
  if (i === n) return MISSING
  let k = i
  let c = text.charCodeAt(k)
  const minus = c === MINUS
  if (c === 45 || c === 43 || minus) k++
  let digits = 0
  let marks = 0
  let markAt = -1
  for (; k < n; k++) {
    c = text.charCodeAt(k)
    if (c >= 48 && c <= 57) digits++
    else if (c === mark && marks === 0) {
      marks++
      markAt = k
    } else break
  }
  if (k < n && digits > 0 && (c === 101 || c === 69)) {
    // exponent: e, an optional sign, digits
    k++
    if (k < n && (text.charCodeAt(k) === 45 || text.charCodeAt(k) === 43)) k++
    const from = k
    while (k < n && text.charCodeAt(k) >= 48 && text.charCodeAt(k) <= 57) k++
    if (k === from) k = -1
  }
  if (k !== n || digits === 0) {
    const shown = text.slice(i, n)
    if (n - i === 1 && (c === 45 || c === MINUS)) return MISSING
    if (MISSING_WORDS.test(shown)) return MISSING
    const hint = decimal === '.' && /^[+-]?\d+,\d+$/.test(shown) ? ' (a decimal comma? set the decimal mark to ",")' : ''
    return bad(`"${shown}" is not a number${decimal === ',' ? ' with a decimal comma' : ''}${hint}`)
  }
  let body = text.slice(minus ? i + 1 : i, n)
  if (markAt >= 0 && mark !== 46) body = body.replace(',', '.')
  const value = minus ? -Number(body) : Number(body)
  return Number.isFinite(value) ? { ok: true, value } : bad(`"${text.slice(i, n)}" is out of range`)
}
const MISSING: Cell<null> = { ok: true, value: null }

const UNIT_SUFFIX = /^(.*?\d\.?)\s*((?:°|º|\uFFFD)?\s*[CFK]|A|bar[ag]?|psi[ag]?|kPa[ag]?|MPa)\s*$/i

/**
 * A number followed by its unit, as some loggers write cells ("-79,8 °C", "15 psig"): the number and the
 * unit as written (°C → C), or null when the cell carries no unit.
 */
export function splitUnit(text: string): { number: string; unit: string } | null {
  const m = UNIT_SUFFIX.exec(text.trim())
  if (!m) return null
  const raw = m[2]!.replace(/[°º\uFFFD\s]/g, '')
  const unit = /^[cfk]$/i.test(raw) ? raw.toUpperCase() : raw.toLowerCase() === 'kpa' ? 'kPa' : raw.toLowerCase() === 'kpag' ? 'kPag' : raw.toLowerCase() === 'mpa' ? 'MPa' : raw.toLowerCase()
  return { number: m[1]!, unit }
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

const digit = (s: string, i: number) => s.charCodeAt(i) - 48
const isDigit = (s: string, i: number) => {
  const c = s.charCodeAt(i)
  return c >= 48 && c <= 57
}
const two = (s: string, i: number) => digit(s, i) * 10 + digit(s, i + 1)

/**
 * A time reader for one file. The usual fixed layouts ("2025-03-01 14:05:00", "01.03.2025 14:05:00")
 * are read digit by digit, with the day looked up once per date, because a million rows share a few
 * dates; anything else goes through readTime.
 */
export function timeReader(format: Exclude<TimeFormat, 'auto'>, offsetMinutes: number): (text: string) => Cell<number> {
  const offsetMs = offsetMinutes * 60_000
  let lastDate = ''
  let lastDayMs = 0
  const fixed = (s: string): number | null => {
    // positions of year, month, day in the first 10 characters, and the separators they need
    let y: number, mo: number, d: number
    if (format === 'iso' && s.charCodeAt(4) === 45 && s.charCodeAt(7) === 45) {
      if (!isDigit(s, 0) || !isDigit(s, 1) || !isDigit(s, 2) || !isDigit(s, 3) || !isDigit(s, 5) || !isDigit(s, 6) || !isDigit(s, 8) || !isDigit(s, 9)) return null
      y = two(s, 0) * 100 + two(s, 2)
      mo = two(s, 5)
      d = two(s, 8)
    } else if (format === 'day-month-year' && s.charCodeAt(2) === 46 && s.charCodeAt(5) === 46) {
      if (!isDigit(s, 0) || !isDigit(s, 1) || !isDigit(s, 3) || !isDigit(s, 4) || !isDigit(s, 6) || !isDigit(s, 7) || !isDigit(s, 8) || !isDigit(s, 9)) return null
      d = two(s, 0)
      mo = two(s, 3)
      y = two(s, 6) * 100 + two(s, 8)
    } else return null
    const sep = s.charCodeAt(10)
    if (sep !== 32 && sep !== 84) return null
    if (s.charCodeAt(13) !== 58 || !isDigit(s, 11) || !isDigit(s, 12) || !isDigit(s, 14) || !isDigit(s, 15)) return null
    let sec = 0
    if (s.length === 19) {
      if (s.charCodeAt(16) !== 58 || !isDigit(s, 17) || !isDigit(s, 18)) return null
      sec = two(s, 17)
    }
    const h = two(s, 11)
    const mi = two(s, 14)
    if (h > 23 || mi > 59 || sec > 59) return null
    const date = s.slice(0, 10)
    if (date !== lastDate) {
      if (mo < 1 || mo > 12 || d < 1) return null
      const dayMs = Date.UTC(y, mo - 1, d)
      if (new Date(dayMs).getUTCDate() !== d) return null
      lastDate = date
      lastDayMs = dayMs
    }
    return lastDayMs + h * 3_600_000 + mi * 60_000 + sec * 1000 - offsetMs
  }
  return (text) => {
    if ((text.length === 19 || text.length === 16) && (format === 'iso' || format === 'day-month-year')) {
      const t = fixed(text)
      if (t !== null) return { ok: true, value: t }
    }
    return readTime(text, format, offsetMinutes)
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
