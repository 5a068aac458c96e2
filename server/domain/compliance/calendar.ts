/**
 * Calendar arithmetic for compliance deadlines, on whole days. Regulations count days and months
 * between dates, not hours, so every timestamp is reduced to its UTC calendar day first.
 */
import { BadInputError } from '#server/domain/errors'

const MS_PER_DAY = 86_400_000

/** Days since 1970-01-01 of a date, an ISO timestamp or a `YYYY-MM-DD` day (its UTC calendar day). */
export function dayNumber(value: Date | string): number {
  const ms = value instanceof Date ? value.getTime() : Date.parse(/^\d{4}-\d{2}-\d{2}$/.test(value) ? `${value}T00:00:00Z` : value)
  if (!Number.isFinite(ms)) throw new BadInputError(`"${String(value)}" is not a date`)
  return Math.floor(ms / MS_PER_DAY)
}

/** Milliseconds of a date or timestamp, for ordering events within a day. */
export function instant(value: Date | string): number {
  const ms = value instanceof Date ? value.getTime() : Date.parse(/^\d{4}-\d{2}-\d{2}$/.test(value) ? `${value}T00:00:00Z` : value)
  if (!Number.isFinite(ms)) throw new BadInputError(`"${String(value)}" is not a date`)
  return ms
}

/** `YYYY-MM-DD` of a day number. */
export function isoDay(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10)
}

/** The day `months` calendar months after `day`; the 31st of a shorter month falls back to its last day. */
export function addMonths(day: number, months: number): number {
  const d = new Date(day * MS_PER_DAY)
  const y = d.getUTCFullYear()
  const m = d.getUTCMonth() + months
  const lastOfTarget = new Date(Date.UTC(y, m + 1, 0)).getUTCDate()
  return Math.floor(Date.UTC(y, m, Math.min(d.getUTCDate(), lastOfTarget)) / MS_PER_DAY)
}

/** UTC calendar year of a day number. */
export function yearOf(day: number): number {
  return new Date(day * MS_PER_DAY).getUTCFullYear()
}

/** Day number of a month-day (`MM-DD`) in `year`. */
export function dayInYear(year: number, monthDay: string): number {
  const [m, d] = monthDay.split('-').map(Number) as [number, number]
  return Math.floor(Date.UTC(year, m - 1, d) / MS_PER_DAY)
}
