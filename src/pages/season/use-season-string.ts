// A season form's string (the phone's copy when there is no signal) and its save: once on the phone,
// the form shows what happens next; the outbox sends it.
import { onMounted, ref } from 'vue'
import { loadString } from '../../offline/string-cache'
import type { StringDetail } from '../../api/strings'
import { ApiError } from '../../api/http'

/** What the error banner shows: the server's error, or a local one (the phone's storage) in its shape. */
export const asApiError = (err: unknown): ApiError =>
  err instanceof ApiError
    ? err
    : new ApiError(0, 'client_error', err instanceof Error ? err.message : String(err))

export function useSeasonString(id: number) {
  const s = ref<StringDetail | null>(null)
  const loadError = ref<ApiError | null>(null)
  const saving = ref(false)
  const saveError = ref<ApiError | null>(null)
  const saved = ref(false)

  async function load(): Promise<void> {
    loadError.value = null
    try {
      s.value = (await loadString(id)).detail
    } catch (err) {
      loadError.value = asApiError(err)
    }
  }

  async function run(write: (detail: StringDetail) => Promise<void>): Promise<void> {
    if (!s.value || saving.value) return
    saving.value = true
    saveError.value = null
    try {
      await write(s.value)
      saved.value = true
    } catch (err) {
      saveError.value = asApiError(err)
    } finally {
      saving.value = false
    }
  }

  onMounted(load)
  return { s, loadError, load, saving, saveError, saved, run }
}
