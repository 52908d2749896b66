// The app's own basemap archive (BASEMAP_FILE, served at /basemap.pmtiles) drawn on the Leaflet map.
// protomaps-leaflet extends the global `L`, so it is set first and the library loaded after.
import * as L from 'leaflet'
import type { Map as LeafletMap } from 'leaflet'

type Bounds = [[number, number], [number, number]]

/** Adds the archive as the base layer; answers the archive's own bounds to open the map on. */
export async function addPmtilesLayer(map: LeafletMap, url: string): Promise<Bounds | null> {
  ;(window as unknown as { L: typeof L }).L = L
  const [{ leafletLayer }, { PMTiles }] = await Promise.all([import('protomaps-leaflet'), import('pmtiles')])
  // A URL, not a shared reader: protomaps-leaflet bundles its own pmtiles version.
  const layer = leafletLayer({ url, flavor: 'light', lang: 'en' }) as unknown as L.Layer
  layer.addTo(map)
  const h = await new PMTiles(url).getHeader()
  if (!(h.maxLat > h.minLat && h.maxLon > h.minLon)) return null
  return [
    [h.minLat, h.minLon],
    [h.maxLat, h.maxLon],
  ]
}

/** Archives up to this size are fetched whole once, so the service worker can keep them offline. */
const WHOLE_FILE_MAX_BYTES = 80 * 1024 * 1024

/** Fetches a small archive in full once; the service worker then answers every range from its copy. */
export async function keepArchiveOffline(url: string): Promise<void> {
  if (!('serviceWorker' in navigator) || !navigator.serviceWorker.controller) return
  const cached = await caches.match(url)
  if (cached) return
  const head = await fetch(url, { method: 'HEAD' })
  const size = Number(head.headers.get('Content-Length') ?? 'NaN')
  if (head.ok && size > 0 && size <= WHOLE_FILE_MAX_BYTES) await fetch(url)
}
