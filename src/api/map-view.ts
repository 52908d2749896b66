// The map's compact answer (GET /strings/map; shared/schemas/map-view.ts), unpacked into the map's
// own items and groups.
import { http } from './http'
import type { Bbox, MapItem } from './strings'
import type { MapView } from '../../shared/schemas/map-view'
import { URGENCY_ORDER } from '../../shared/vocab/map-view'

export { MAP_DETAIL_ZOOM, URGENCY_ORDER } from '../../shared/vocab/map-view'

/** A group of strings the server drew as one mark: where, how many, and the most urgent state in it. */
export interface MapCluster {
  lat: number
  lng: number
  count: number
  worst: MapItem['status']
}

export interface MapStrings {
  total: number
  items: MapItem[]
  clusters: MapCluster[]
}

// Six decimals is about 0.1 m: finer only defeats the server's cache for no gain.
const coord = (n: number) => n.toFixed(6)

export function unpackMapView(v: MapView): MapStrings {
  const lines = new Map(v.lines)
  return {
    total: v.total,
    items: v.items.map(([id, lat, lng, u, lampsOut, replaceNow, assetTag, name]) => ({
      id,
      lat,
      lng,
      status: URGENCY_ORDER[u],
      lampsOut,
      replaceNow: replaceNow === 1,
      assetTag,
      name,
      line: lines.get(id) ?? null,
    })),
    clusters: v.clusters.map(([lat, lng, count, u]) => ({ lat, lng, count, worst: URGENCY_ORDER[u] })),
  }
}

export const mapViewApi = {
  get: async (bbox: Bbox, zoom: number, signal?: AbortSignal) =>
    unpackMapView(
      await http.get<MapView>(
        '/strings/map',
        { bbox: bbox.map(coord).join(','), zoom: Math.floor(zoom) },
        signal,
      ),
    ),
}
