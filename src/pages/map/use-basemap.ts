import { computed, shallowRef } from 'vue'
import { ApiError } from '../../api/http'
import { basemapApi, type Basemap } from '../../api/basemap'
import { featureBounds } from '../../components/map/basemap-geometry'

/** The demo town's drawn streets and the bounds the map first opens on. */
export function useBasemap() {
  const basemap = shallowRef<Basemap | null>(null)
  const basemapError = shallowRef<ApiError | null>(null)
  const townBounds = computed(() => (basemap.value ? featureBounds(basemap.value.features) : null))

  async function loadBasemap(): Promise<void> {
    basemapError.value = null
    try {
      basemap.value = await basemapApi.get()
    } catch (err) {
      basemapError.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
    }
  }

  return { basemap, basemapError, townBounds, loadBasemap }
}
