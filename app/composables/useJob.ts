import type { JobDto } from '#shared/types/jobs'

/**
 * Follows a background job (`GET /api/jobs/{id}`) until it is done or failed: its state, progress
 * and result, refreshed every `ms` while it runs. Give it the id a route answered with.
 */
export function useJob<Result = unknown>(jobId: MaybeRefOrGetter<string | null | undefined>, ms = 1000) {
  const job = ref<JobDto<Result> | null>(null) as Ref<JobDto<Result> | null>
  const error = ref('')
  const finished = computed(() => job.value?.state === 'done' || job.value?.state === 'failed')

  async function refresh() {
    const id = toValue(jobId)
    if (!id) return
    try {
      job.value = await $fetch<JobDto<Result>>(`/api/jobs/${encodeURIComponent(id)}`)
      error.value = ''
    } catch (e) {
      error.value = messageOf(e, 'The state of this job could not be read.')
    }
  }

  watch(() => toValue(jobId), () => {
    job.value = null
    if (import.meta.client) void refresh()
  }, { immediate: true })
  usePollWhile(() => !!toValue(jobId) && !finished.value && !error.value, refresh, ms, 600)

  return { job, error, finished, refresh }
}
