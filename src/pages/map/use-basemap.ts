import { computed, shallowRef, type Ref } from 'vue'
import { ApiError } from '../../api/http'
import { basemapApi, type Basemap } from '../../api/basemap'
import { stringsApi } from '../../api/strings'
import type { AppConfig } from '../../api/config'
import { featureBounds } from '../../components/map/basemap-geometry'

type Bounds = [[number, number], [number, number]]

/**
 * The basemap GET /config names: the app's PMTiles archive, a tile server, the demo town's drawn
 * streets, or none (strings on a plain background, with a notice). Also the bounds the map opens on.
 */
export function useBasemap(config: Ref<AppConfig>) {
  const kind = computed(() => config.value.basemap?.kind ?? 'none')
  const tileUrl = computed(() => (kind.value === 'tile_server' ? config.value.basemap.url : null))
  const pmtilesUrl = computed(() => (kind.value === 'pmtiles' ? config.value.basemap.url : null))
  const basemap = shallowRef<Basemap | null>(null)
  const basemapError = shallowRef<ApiError | null>(null)
  const stringBounds = shallowRef<Bounds | null>(null)
  const townBounds = computed(() =>
    basemap.value ? featureBounds(basemap.value.features) : stringBounds.value,
  )

  async function loadBasemap(): Promise<void> {
    basemapError.value = null
    try {
      if (kind.value === 'demo') basemap.value = await basemapApi.get()
      else stringBounds.value = await boundsOfStrings()
    } catch (err) {
      basemapError.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
    }
  }

  return { kind, tileUrl, pmtilesUrl, basemap, basemapError, townBounds, loadBasemap }
}

/** Where the strings are, so a town without drawn streets still opens on its own lights. */
async function boundsOfStrings(): Promise<Bounds | null> {
  const { items } = await stringsApi.inBox([-180, -85, 180, 85])
  if (!items.length) return null
  const lats = items.map((i) => i.lat)
  const lngs = items.map((i) => i.lng)
  return [
    [Math.min(...lats), Math.min(...lngs)],
    [Math.max(...lats), Math.max(...lngs)],
  ]
}
