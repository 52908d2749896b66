import { onBeforeUnmount, ref, shallowRef } from 'vue'
import { ApiError } from '../../api/http'
import { stringsApi, type Bbox, type MapItem } from '../../api/strings'

// Wait for the map to settle before asking: a pan is often several moves in a row.
const DEBOUNCE_MS = 250
// Fetch half a screen beyond each edge so short pans show strings at once, without a request.
const PAD = 0.5

export function padBbox([w, s, e, n]: Bbox, by = PAD): Bbox {
  const dx = (e - w) * by
  const dy = (n - s) * by
  return [w - dx, Math.max(-90, s - dy), e + dx, Math.min(90, n + dy)]
}

function contains(outer: Bbox, inner: Bbox): boolean {
  return outer[0] <= inner[0] && outer[1] <= inner[1] && outer[2] >= inner[2] && outer[3] >= inner[3]
}

/** Strings around the visible map, refreshed as it moves; stale requests are cancelled. */
export function useMapStrings() {
  const items = shallowRef<MapItem[]>([])
  const truncated = ref(false)
  const loading = ref(false)
  const error = shallowRef<ApiError | null>(null)
  let covered: Bbox | null = null
  let controller: AbortController | null = null
  let timer: ReturnType<typeof setTimeout> | undefined
  let lastView: Bbox | null = null

  function viewChanged(view: Bbox): void {
    lastView = view
    clearTimeout(timer)
    timer = setTimeout(() => void load(view), DEBOUNCE_MS)
  }

  async function load(view: Bbox, force = false): Promise<void> {
    // Zooming in or a short pan stays inside what we already hold, unless that answer was cut short.
    if (!force && covered && !truncated.value && contains(covered, view)) return
    controller?.abort()
    const mine = (controller = new AbortController())
    const box = padBbox(view)
    loading.value = true
    error.value = null
    try {
      const res = await stringsApi.inBox(box, mine.signal)
      items.value = res.items
      truncated.value = res.truncated
      covered = box
    } catch (err) {
      if (mine.signal.aborted) return
      error.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
    } finally {
      if (controller === mine) loading.value = false
    }
  }

  function reload(): Promise<void> {
    return lastView ? load(lastView, true) : Promise.resolve()
  }

  onBeforeUnmount(() => {
    clearTimeout(timer)
    controller?.abort()
  })

  return { items, truncated, loading, error, viewChanged, load, reload }
}
