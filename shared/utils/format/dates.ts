// Dates and times in one format everywhere: "2026-12-02 14:05 CET". Screens use the person's time
// zone; reports and e-mails the organisation's, so a customer reads the times of their own site.

const formatters = new Map<string, Intl.DateTimeFormat>()

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone)
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short',
    })
    formatters.set(timeZone, f)
  }
  return f
}

/** True when `timeZone` is an IANA zone this runtime knows ("Europe/Oslo", "UTC"). */
export function isTimeZone(timeZone: string): boolean {
  try {
    formatterFor(timeZone)
    return true
  } catch {
    return false
  }
}

function parts(iso: string | Date, timeZone: string) {
  const date = typeof iso === 'string' ? new Date(iso) : iso
  const zone = isTimeZone(timeZone) ? timeZone : 'UTC'
  const p = Object.fromEntries(formatterFor(zone).formatToParts(date).map((x) => [x.type, x.value]))
  return { date: `${p.year}-${p.month}-${p.day}`, time: `${p.hour}:${p.minute}`, zone: p.timeZoneName ?? zone }
}

/** "2026-12-02 14:05 CET": a moment in `timeZone`, with the zone named. */
export function formatDateTime(iso: string | Date, timeZone: string): string {
  const p = parts(iso, timeZone)
  return `${p.date} ${p.time} ${p.zone}`
}

/** "2026-12-02": the calendar day of a moment in `timeZone`. */
export function formatDate(iso: string | Date, timeZone: string): string {
  return parts(iso, timeZone).date
}

/** "45 min", "2 h 05 min", "3 d 4 h": a length of time given in minutes. */
export function formatDuration(minutes: number): string {
  if (!Number.isFinite(minutes) || minutes < 0) return '—'
  const total = Math.round(minutes)
  if (total < 60) return `${total} min`
  const days = Math.floor(total / 1440)
  const hours = Math.floor((total % 1440) / 60)
  const mins = total % 60
  if (days) return hours ? `${days} d ${hours} h` : `${days} d`
  return `${hours} h ${String(mins).padStart(2, '0')} min`
}
