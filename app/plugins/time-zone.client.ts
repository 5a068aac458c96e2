import { isTimeZone } from '#shared/utils/format'

// Once the page has hydrated, switch to the browser's own time zone if the server guessed another
// (first visit, travel), and remember it for the next server render.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.hook('app:suspense:resolve', () => {
    const browser = Intl.DateTimeFormat().resolvedOptions().timeZone
    if (!browser || !isTimeZone(browser)) return
    nuxtApp.runWithContext(() => {
      const zone = useTimeZone()
      if (zone.value !== browser) zone.value = browser
      useCookie<string | null>(TIME_ZONE_COOKIE, { sameSite: 'lax', maxAge: 60 * 60 * 24 * 365 }).value = browser
    })
  })
})
