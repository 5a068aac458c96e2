/**
 * True once this component is live in the browser. Form fields stay disabled until then: a value
 * typed into server-rendered HTML before hydration would be overwritten by the form's own state.
 */
export function useHydrated() {
  const hydrated = ref(false)
  onMounted(() => (hydrated.value = true))
  return readonly(hydrated)
}
