import { useIntervalFn, useOnline } from '@vueuse/core'
import type { CaseDto } from '#shared/types/cases'

type SyncState = 'saved' | 'saving' | 'queued' | 'offline' | 'conflict' | 'error'

const isNetworkFailure = (e: unknown) => {
  const status = (e as { statusCode?: number; response?: unknown })?.statusCode
  return status === undefined
}

/**
 * Loads one case and sends the technician's changes. Each change carries the case version, so a
 * concurrent edit comes back as 409 and is shown, never silently merged. Without a connection the
 * change is queued locally and sent, in order, when the connection returns.
 */
export function useCaseWorkspace(caseId: number) {
  const drafts = useCaseDraftStore()
  const online = useOnline()
  const { data: record, refresh, error, status } = useFetch<CaseDto>(`/api/cases/${caseId}`, { key: `case-${caseId}` })
  const state = ref<SyncState>('saved')
  const message = ref('')
  const queued = computed(() => drafts.queuedFor(caseId))
  /** A change the server asked to confirm (readings far outside the unit's design envelope): what was sent and what it asks. */
  const confirmation = ref<{ path: string; body: Record<string, unknown>; label: string; questions: { index: number; message: string }[] } | null>(null)

  async function post(path: string, body: Record<string, unknown>, method: 'POST' | 'PUT' = 'POST') {
    return $fetch<CaseDto>(`/api/cases/${caseId}/${path}`, { method, body })
  }

  /** Sends one change; returns true when the server stored it. */
  async function send(path: string, body: Record<string, unknown>, label: string, method: 'POST' | 'PUT' = 'POST'): Promise<boolean> {
    if (!online.value) {
      drafts.enqueue({ caseId, path, method, body, label })
      state.value = 'queued'
      message.value = `No connection: “${label}” is kept on this device and will be sent when you are back online.`
      return true
    }
    state.value = 'saving'
    try {
      record.value = await post(path, { ...body, version: record.value?.version }, method)
      confirmation.value = null
      state.value = 'saved'
      message.value = ''
      return true
    } catch (e) {
      if (isNetworkFailure(e)) {
        drafts.enqueue({ caseId, path, method, body, label })
        state.value = 'queued'
        message.value = `The connection dropped: “${label}” is kept on this device and will be sent when it returns.`
        return true
      }
      const statusCode = (e as { statusCode?: number }).statusCode
      const questions = (e as { data?: { data?: { confirmationNeeded?: { index: number; message: string }[] } } }).data?.data?.confirmationNeeded
      confirmation.value = statusCode === 422 && questions?.length ? { path, body, label, questions } : null
      state.value = statusCode === 409 ? 'conflict' : 'error'
      message.value = messageOf(e)
      return false
    }
  }

  let flushing = false
  /** Sends queued changes in order; appends need no version, so they are replayed as they were. */
  async function flush() {
    if (flushing) return
    flushing = true
    try {
      await sendQueued()
    } finally {
      flushing = false
    }
  }
  async function sendQueued() {
    for (const change of drafts.queuedFor(caseId)) {
      try {
        record.value = await post(change.path, change.body, change.method)
        drafts.remove(change.key)
      } catch (e) {
        if (isNetworkFailure(e)) return
        drafts.markFailed(change.key, messageOf(e))
      }
    }
    if (!drafts.queuedFor(caseId).some((c) => c.lastError)) {
      state.value = 'saved'
      message.value = ''
    }
  }

  async function reload() {
    await refresh()
    state.value = 'saved'
    message.value = ''
  }

  watch(online, (now) => {
    if (now) void flush()
    else state.value = 'offline'
  })
  // The browser may say it is online while nothing gets through (a weak signal, a sign-in portal):
  // changes still waiting are tried again every 15 s, refused ones only when asked.
  const retry = useIntervalFn(() => {
    if (online.value && queued.value.some((c) => !c.lastError)) void flush()
  }, 15_000, { immediate: false })
  onMounted(() => {
    retry.resume()
    if (!online.value) state.value = 'offline'
    else if (queued.value.length) void flush()
  })

  return { record, error, status, state, message, queued, online, confirmation, send, flush, reload }
}
