// The demo town's own basemap as GeoJSON: an invented town has no real map tiles, so the seed stores
// these streets, squares, gardens and the river for the client to draw (TILE_URL replaces it).
import { river, streets } from './town'
import { toLatLng } from './geo'

const ll = ([x, y]: [number, number]) => {
  const p = toLatLng(x, y)
  return [p.lng, p.lat]
}

interface Feature {
  type: 'Feature'
  properties: { name: string; kind: string; widthM: number }
  geometry: { type: 'LineString' | 'Polygon'; coordinates: unknown[] }
}

export function demoBasemap() {
  const features: Feature[] = streets.map((s) => ({
    type: 'Feature' as const,
    properties: { name: s.name, kind: s.kind, widthM: s.widthM },
    geometry:
      s.kind === 'street'
        ? { type: 'LineString' as const, coordinates: s.path.map(ll) }
        : { type: 'Polygon' as const, coordinates: [s.path.map(ll)] },
  }))
  features.push({
    type: 'Feature',
    properties: { name: 'River Wren', kind: 'river', widthM: 30 },
    geometry: { type: 'LineString', coordinates: river.map(ll) },
  })
  return { type: 'FeatureCollection' as const, features }
}
