import type { BasemapFeature } from '../../api/basemap'

export type LngLat = [number, number]
export type LatLngPair = [number, number]

// Web Mercator ground resolution for 256 px tiles: equator circumference (WGS 84, 40 075 016.686 m)
// × cos(latitude) / 2^(zoom + 8) (OpenStreetMap wiki, "Zoom levels").
export function metresPerPixel(lat: number, zoom: number): number {
  return (40075016.686 * Math.cos((lat * Math.PI) / 180)) / 2 ** (zoom + 8)
}

/** Stroke width in pixels for something `widthM` metres wide at this zoom; never thinner than `min`. */
export function widthPx(widthM: number, lat: number, zoom: number, min = 1.5): number {
  return Math.max(min, widthM / metresPerPixel(lat, zoom))
}

export function toLatLngs(coords: LngLat[]): LatLngPair[] {
  return coords.map(([lng, lat]) => [lat, lng])
}

export function lineCoords(f: BasemapFeature): LngLat[] {
  return (f.geometry.type === 'Polygon' ? f.geometry.coordinates[0] : f.geometry.coordinates) as LngLat[]
}

/** [[south, west], [north, east]] around every feature, or null for an empty map. */
export function featureBounds(features: BasemapFeature[]): [LatLngPair, LatLngPair] | null {
  let s = Infinity
  let w = Infinity
  let n = -Infinity
  let e = -Infinity
  for (const f of features) {
    for (const [lng, lat] of lineCoords(f)) {
      s = Math.min(s, lat)
      n = Math.max(n, lat)
      w = Math.min(w, lng)
      e = Math.max(e, lng)
    }
  }
  return Number.isFinite(s)
    ? [
        [s, w],
        [n, e],
      ]
    : null
}

export interface LabelSpot {
  lat: number
  lng: number
  /** degrees clockwise from east, as CSS rotate() reads it */
  angle: number
}

// `at` of the way along the line (0.5 = half-way), turned to follow the segment there. Lengths use
// the local flat approximation (a degree of longitude is cos(latitude) degrees of latitude), enough
// for placing a label.
export function lineLabelSpot(coords: LngLat[], at = 0.5): LabelSpot {
  const k = Math.cos((coords[0][1] * Math.PI) / 180)
  const seg = coords.slice(1).map((p, i) => Math.hypot((p[0] - coords[i][0]) * k, p[1] - coords[i][1]))
  let left = seg.reduce((a, b) => a + b, 0) * at
  for (let i = 0; i < seg.length; i++) {
    const [a, b] = [coords[i], coords[i + 1]]
    if (left <= seg[i] || i === seg.length - 1) {
      const t = seg[i] > 0 ? Math.min(1, left / seg[i]) : 0
      const angle = (-Math.atan2(b[1] - a[1], (b[0] - a[0]) * k) * 180) / Math.PI
      return { lng: a[0] + (b[0] - a[0]) * t, lat: a[1] + (b[1] - a[1]) * t, angle }
    }
    left -= seg[i]
  }
  return { lng: coords[0][0], lat: coords[0][1], angle: 0 }
}

export function areaLabelSpot(ring: LngLat[]): LabelSpot {
  // The closing vertex repeats the first; leave it out of the mean.
  const pts = ring.length > 1 ? ring.slice(0, -1) : ring
  const lng = pts.reduce((s, p) => s + p[0], 0) / pts.length
  const lat = pts.reduce((s, p) => s + p[1], 0) / pts.length
  return { lat, lng, angle: 0 }
}
