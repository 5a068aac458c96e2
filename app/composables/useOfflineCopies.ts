import type { MaybeRefOrGetter } from 'vue'

/** Names of the caches the service worker keeps pages, data and files in (see nuxt.config.ts). */
const OFFLINE_CACHES = /^rimecase-/

async function controlled(): Promise<boolean> {
  if (!('serviceWorker' in navigator)) return false
  if (navigator.serviceWorker.controller) return true
  // A first visit: the worker takes the page over once it has installed.
  return new Promise((resolve) => {
    navigator.serviceWorker.addEventListener('controllerchange', () => resolve(true), { once: true })
    setTimeout(() => resolve(!!navigator.serviceWorker.controller), 15_000)
  })
}

/**
 * Keeps an offline copy of the given cases: once the page is live and the service worker controls
 * it, each case page and its record are fetched through the worker, which stores them. A technician
 * who opened the app in the office then finds these cases in a basement plant room, also after a
 * reload. Does nothing without a connection or a service worker.
 */
export function useOfflineCopies(caseIds: MaybeRefOrGetter<number[]>) {
  onMounted(async () => {
    if (!navigator.onLine || !(await controlled())) return
    for (const id of toValue(caseIds)) {
      await Promise.allSettled([
        fetch(`/cases/${id}`, { headers: { 'x-rimecase-offline': 'page' }, credentials: 'same-origin' }),
        fetch(`/api/cases/${id}`, { credentials: 'same-origin' }),
      ])
    }
  })
}

/** Forgets every offline copy: on signing out, the next person on this device sees none of them. */
export async function forgetOfflineCopies() {
  if (typeof caches === 'undefined') return
  for (const name of await caches.keys()) if (OFFLINE_CACHES.test(name)) await caches.delete(name)
}
