/**
 * Calls `refresh` every `ms` while `active()` holds, in the browser only, and stops after
 * `maxTimes` calls so a page left open does not poll for ever.
 */
export function usePollWhile(active: () => boolean, refresh: () => Promise<unknown>, ms = 3000, maxTimes = 40) {
  let timer: ReturnType<typeof setInterval> | undefined
  let count = 0
  const stop = () => {
    if (timer) clearInterval(timer)
    timer = undefined
  }
  const start = () => {
    if (timer || !active()) return
    count = 0
    timer = setInterval(async () => {
      if (!active() || ++count > maxTimes) return stop()
      await refresh()
    }, ms)
  }
  onMounted(() => watch(active, (on) => (on ? start() : stop()), { immediate: true }))
  onBeforeUnmount(stop)
}
