import { useLocalStorage } from '@vueuse/core'
import { defineStore, skipHydrate } from 'pinia'

export interface ReadingDraft {
  stage: string
  quantity: string
  value: string
  unit: string
}

export interface QueuedChange {
  key: string
  caseId: number
  path: string
  method: 'POST' | 'PUT'
  body: Record<string, unknown>
  label: string
  queuedAt: string
  lastError?: string
}

/**
 * What the technician typed but the server has not stored yet: the reading being entered (kept
 * across reloads) and changes made without a connection, sent in order when it returns.
 */
export const useCaseDraftStore = defineStore('caseDrafts', () => {
  const drafts = useLocalStorage<Record<string, ReadingDraft>>('rimecase:reading-drafts', {})
  const notes = useLocalStorage<Record<string, string>>('rimecase:note-drafts', {})
  const queue = useLocalStorage<QueuedChange[]>('rimecase:queued-changes', [])

  function enqueue(change: Omit<QueuedChange, 'key' | 'queuedAt'>) {
    queue.value = [...queue.value, { ...change, key: `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`, queuedAt: new Date().toISOString() }]
  }
  function remove(key: string) {
    queue.value = queue.value.filter((c) => c.key !== key)
  }
  function markFailed(key: string, message: string) {
    queue.value = queue.value.map((c) => (c.key === key ? { ...c, lastError: message } : c))
  }
  const queuedFor = (caseId: number) => queue.value.filter((c) => c.caseId === caseId)

  // Kept in this browser's storage, never in the server-rendered state, so hydration cannot wipe them.
  return { drafts: skipHydrate(drafts), notes: skipHydrate(notes), queue: skipHydrate(queue), enqueue, remove, markFailed, queuedFor }
})
