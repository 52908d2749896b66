import { ref, shallowRef, type Ref } from 'vue'
import { ApiError } from '../api/http'

export interface RequestState<T> {
  data: Ref<T | null>
  loading: Ref<boolean>
  error: Ref<ApiError | null>
  reload: () => Promise<void>
}

/** Runs a loader now (unless `immediate: false`) and exposes `{ data, loading, error, reload }`. */
export function useRequest<T>(
  loader: () => Promise<T>,
  options: { immediate?: boolean } = {},
): RequestState<T> {
  const data = shallowRef<T | null>(null) as Ref<T | null>
  const loading = ref(false)
  const error = shallowRef<ApiError | null>(null)
  let generation = 0

  async function reload(): Promise<void> {
    // A slower earlier call must not overwrite the result of a newer one.
    const mine = ++generation
    loading.value = true
    error.value = null
    try {
      const result = await loader()
      if (mine === generation) data.value = result
    } catch (err) {
      if (mine === generation) {
        error.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
      }
    } finally {
      if (mine === generation) loading.value = false
    }
  }

  if (options.immediate !== false) void reload()
  return { data, loading, error, reload }
}
