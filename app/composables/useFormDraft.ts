import type { Ref } from 'vue'

/**
 * Keeps a form's draft in this browser's local storage as it is typed, so a dropped connection, a
 * flat battery or a mis-tap on "back" in a plant room does not lose the work. It loads only after
 * mounting, so the server-rendered page and the first browser render agree.
 */
export function useFormDraft<T extends object>(key: string, draft: Ref<T>) {
  const restored = ref(false)
  const storageKey = `rimecase:draft:${key}`
  let original = ''

  onMounted(() => {
    original = JSON.stringify(draft.value)
    const saved = localStorage.getItem(storageKey)
    if (saved && saved !== original) {
      try {
        draft.value = JSON.parse(saved) as T
        restored.value = true
      } catch {
        localStorage.removeItem(storageKey)
      }
    }
    watch(draft, (value) => {
      const text = JSON.stringify(value)
      if (text === original) localStorage.removeItem(storageKey)
      else localStorage.setItem(storageKey, text)
    }, { deep: true })
  })

  /** Forgets the stored draft (after saving, or when the user discards it). */
  function clear() {
    if (import.meta.client) localStorage.removeItem(storageKey)
    restored.value = false
  }
  /** Goes back to the form as it was first shown. */
  function discard() {
    draft.value = JSON.parse(original) as T
    clear()
  }
  return { restored, clear, discard }
}
