import { ref, type Ref } from 'vue'
import { isApiError } from '../api/http'

/**
 * What a form dialog does on submit: one save at a time (`busy` drives the button's spinner), the
 * failure in words (`errorText`, for FormDialog's banner), and the dialog closed once it succeeded.
 * `failed` is said when the server's own message cannot be, e.g. "The item was not closed. Try again."
 */
export function useDialogSubmit(open: Ref<boolean> | null, failed: string) {
  const busy = ref(false)
  const errorText = ref<string | null>(null)

  /**
   * Runs `action` and answers whether it succeeded. `onError` may word a failure itself (a string),
   * show it elsewhere, say on a field (null), or leave it to the default (undefined).
   */
  async function submit(
    action: () => Promise<unknown>,
    onError?: (err: unknown) => string | null | undefined,
  ): Promise<boolean> {
    if (busy.value) return false
    busy.value = true
    errorText.value = null
    try {
      await action()
      if (open) open.value = false
      return true
    } catch (err) {
      const own = onError?.(err)
      errorText.value = own !== undefined ? own : isApiError(err) ? err.message : failed
      return false
    } finally {
      busy.value = false
    }
  }

  function clearError(): void {
    errorText.value = null
  }

  return { busy, errorText, submit, clearError }
}
