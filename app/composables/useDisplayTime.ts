import { formatDate, formatDateTime, isTimeZone } from '#shared/utils/format'

/** Name of the cookie that tells the server which time zone this browser shows times in. */
export const TIME_ZONE_COOKIE = 'rimecase-tz'

/**
 * The time zone screens show times in: the person's own, from their browser. The server renders
 * with the zone remembered in a cookie, so the first paint and the hydrated page agree; the
 * time-zone plugin corrects it once after mounting if the browser says otherwise.
 */
export function useTimeZone() {
  const cookie = useCookie<string | null>(TIME_ZONE_COOKIE, { sameSite: 'lax', maxAge: 60 * 60 * 24 * 365 })
  return useState('time-zone', () => (cookie.value && isTimeZone(cookie.value) ? cookie.value : 'UTC'))
}

/** Dates and times for the screen, in the person's time zone and the app's one format. */
export function useDisplayTime() {
  const zone = useTimeZone()
  return {
    zone,
    /** "2026-12-02 14:05 CET" */
    dateTime: (iso: string | Date) => formatDateTime(iso, zone.value),
    /** "2026-12-02" */
    date: (iso: string | Date) => formatDate(iso, zone.value),
  }
}
