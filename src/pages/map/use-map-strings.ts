import { onBeforeUnmount, ref, shallowRef } from 'vue'
import { ApiError } from '../../api/http'
import type { Bbox, MapItem } from '../../api/strings'
import { MAP_DETAIL_ZOOM, mapViewApi, type MapCluster } from '../../api/map-view'

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

/**
 * Strings around the visible map, refreshed as it moves; stale requests are cancelled. Below
 * MAP_DETAIL_ZOOM the server sends groups (`clusters`) and the strings standing alone; from it on,
 * every string, which the map groups itself where marks would overlap.
 */
export function useMapStrings() {
  const items = shallowRef<MapItem[]>([])
  const clusters = shallowRef<MapCluster[]>([])
  const loading = ref(false)
  const error = shallowRef<ApiError | null>(null)
  let covered: { box: Bbox; zoom: number; whole: boolean } | null = null
  let controller: AbortController | null = null
  let timer: ReturnType<typeof setTimeout> | undefined
  let lastView: { view: Bbox; zoom: number } | null = null

  function viewChanged(view: Bbox, zoom: number): void {
    lastView = { view, zoom }
    clearTimeout(timer)
    timer = setTimeout(() => void load(view, zoom), DEBOUNCE_MS)
  }

  /** Does the last answer already show this view as it should be drawn at this zoom? */
  function holds(view: Bbox, zoom: number): boolean {
    if (!covered || !contains(covered.box, view)) return false
    // Every string, one by one: right for any zoom from the detail zoom on.
    if (covered.whole) return zoom >= MAP_DETAIL_ZOOM
    // Groups are made for one zoom.
    return Math.floor(zoom) === covered.zoom
  }

  async function load(view: Bbox, zoom: number, force = false): Promise<void> {
    if (!force && holds(view, zoom)) return
    controller?.abort()
    const mine = (controller = new AbortController())
    const box = padBbox(view)
    loading.value = true
    error.value = null
    try {
      const res = await mapViewApi.get(box, zoom, mine.signal)
      items.value = res.items
      clusters.value = res.clusters
      // With no groups at the detail zoom the answer holds every string, lines included.
      const z = Math.floor(zoom)
      covered = { box, zoom: z, whole: res.clusters.length === 0 && z >= MAP_DETAIL_ZOOM }
    } catch (err) {
      if (mine.signal.aborted) return
      error.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
    } finally {
      if (controller === mine) loading.value = false
    }
  }

  function reload(): Promise<void> {
    return lastView ? load(lastView.view, lastView.zoom, true) : Promise.resolve()
  }

  onBeforeUnmount(() => {
    clearTimeout(timer)
    controller?.abort()
  })

  return { items, clusters, loading, error, viewChanged, load, reload }
}
