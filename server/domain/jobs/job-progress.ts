// Small rules of background jobs that need no queue to test.

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i

/** True for a job id as jobs are given (a UUID); anything else names no job. */
export function isUuid(id: string): boolean {
  return UUID.test(id)
}

/**
 * Whether a progress report is worth a database write: the end always is; otherwise it must be at
 * least one percent further and a quarter of a second after the last write, so a job may report on
 * every item it handles without flooding the database.
 */
export function isProgressWorthSaving(saved: number, next: number, msSinceSaved: number): boolean {
  if (!Number.isFinite(next)) return false
  if (next >= 1 && saved < 1) return true
  return Math.abs(next - saved) >= 0.01 && msSinceSaved >= 250
}
