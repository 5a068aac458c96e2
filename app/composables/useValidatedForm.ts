import type { ZodType } from 'zod'
import { zodFieldErrors } from '#shared/utils/input-errors'

/**
 * The submit cycle every form shares: busy flag, form message and per-field messages. `submit`
 * checks the value with the same zod schema the route uses and sends it only when it passes; the
 * server's own field errors (a duplicate serial, say) land in the same `fieldErrors`, so they show
 * beside the same fields.
 */
export function useValidatedForm() {
  const fieldErrors = ref<Record<string, string[]>>({})
  const error = ref('')
  const busy = ref(false)

  async function submit<T>(schema: ZodType<T>, value: unknown, send: (data: T) => Promise<void>): Promise<boolean> {
    error.value = ''
    const parsed = schema.safeParse(value)
    if (!parsed.success) {
      fieldErrors.value = zodFieldErrors(parsed.error)
      error.value = 'Some fields need another look; see the messages below them.'
      return false
    }
    busy.value = true
    try {
      await send(parsed.data)
      fieldErrors.value = {}
      return true
    } catch (e) {
      error.value = messageOf(e)
      fieldErrors.value = fieldErrorsOf(e)
      return false
    } finally {
      busy.value = false
    }
  }

  return { fieldErrors, error, busy, submit }
}
