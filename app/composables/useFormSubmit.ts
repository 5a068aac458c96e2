import type { ZodType } from 'zod'

/**
 * The submit cycle every form shares: check the input with the same zod schema the server uses,
 * send it, and show the server's message and field errors when it refuses.
 */
export function useFormSubmit<T>(schema: ZodType<T>, send: (data: T) => Promise<void>) {
  const fieldErrors = ref<Record<string, string[]>>({})
  const error = ref('')
  const busy = ref(false)

  async function submit(input: unknown) {
    error.value = ''
    const parsed = schema.safeParse(input)
    if (!parsed.success) {
      fieldErrors.value = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), [i.message]]))
      return
    }
    fieldErrors.value = {}
    busy.value = true
    try {
      await send(parsed.data)
    } catch (e) {
      error.value = messageOf(e)
      fieldErrors.value = fieldErrorsOf(e)
    } finally {
      busy.value = false
    }
  }

  return { fieldErrors, error, busy, submit }
}
