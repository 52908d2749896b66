// The map's compact answer (shared/schemas/map-view.ts; its limits in shared/vocab/map-view.ts).
// Below MAP_DETAIL_ZOOM, or with more than MAP_MAX_ITEMS strings in the box, strings are grouped on
// a fixed grid of squares about MAP_CELL_PX screen pixels across at that zoom (fixed to the globe,
// not to the box, so a pan keeps the same groups); a square holding one string sends that string,
// read fresh. The grouping works from each process's copy of every live string's position and state
// (map-positions.ts), at most 5 s old: grouping thousands of rows in SQL for every zoomed-out pan
// cost ~20 ms of MariaDB per request, this a few ms of JavaScript. The (lat, lng) index serves the
// street-zoom box.
import type { Db } from '../db'
import { lineOf } from './strings'
import type { MapView } from '../../shared/schemas/map-view'
import { MAP_CELL_PX, MAP_DETAIL_ZOOM, MAP_MAX_ITEMS } from '../../shared/vocab/map-view'
import { positions, urgencyCase } from './map-positions'

type Box = [number, number, number, number]

// The box is read through the map's own index (migrations/20261202001000_load_indexes.ts). Left to
// itself, MariaDB sometimes intersected the (lat, lng) index with a register index on status for a
// street-sized box: 18.6 ms a box instead of 1.2 (p95 19.9 ms against 2.6 ms with this hint, over
// 20,000 strings); weighing the ten indexes that mention archived_at also cost ~0.3 ms a query.
const inBox = (db: Db, [minLng, minLat, maxLng, maxLat]: Box) =>
  db
    .from(db.raw('strings as s use index (strings_map_cover_index)'))
    .whereBetween('s.lat', [minLat, maxLat])
    .whereBetween('s.lng', [minLng, maxLng])
    .whereNull('s.archivedAt') // archived strings leave the map; their history stays

/** The grid's square at `zoom`, in degrees of longitude and latitude (Web Mercator, at the box's middle). */
export function cellDegrees(zoom: number, midLat: number): { dLng: number; dLat: number } {
  const dLng = (360 / 2 ** zoom) * (MAP_CELL_PX / 256)
  return { dLng, dLat: dLng * Math.max(0.05, Math.cos((midLat * Math.PI) / 180)) }
}

async function itemRows(db: Db, q: ReturnType<typeof inBox>, withLines: boolean) {
  const rows = await q.select(
    's.id',
    's.lat',
    's.lng',
    db.raw(`${urgencyCase} as u`),
    's.lampsOut',
    's.replaceNow',
    's.assetTag',
    's.name',
    ...(withLines ? ['s.line'] : []),
  )
  const items: MapView['items'] = rows.map((r) => [
    r.id,
    r.lat,
    r.lng,
    Number(r.u),
    r.lampsOut,
    r.replaceNow ? 1 : 0,
    r.assetTag,
    r.name,
  ])
  const lines: MapView['lines'] = []
  if (withLines)
    for (const r of rows) {
      const line = lineOf(r.line)
      if (line && line.length > 1) lines.push([r.id, line])
    }
  return { items, lines }
}

export async function mapView(db: Db, bbox: Box, zoom: number): Promise<MapView> {
  const detail = zoom >= MAP_DETAIL_ZOOM
  if (detail) {
    // One more than the cap tells whether the box is too full to send string by string.
    const all = await itemRows(db, inBox(db, bbox).limit(MAP_MAX_ITEMS + 1), true)
    if (all.items.length <= MAP_MAX_ITEMS) return { total: all.items.length, clusters: [], ...all }
  }
  const { dLng, dLat } = cellDegrees(zoom, (bbox[1] + bbox[3]) / 2)
  const [minLng, minLat, maxLng, maxLat] = bbox
  const p = await positions(db)
  const cells = new Map<string, { n: number; lat: number; lng: number; u: number; id: number }>()
  for (let i = 0; i < p.size; i++) {
    const lat = p.lat[i]
    const lng = p.lng[i]
    // An archived string's lat is NaN: no comparison with it holds.
    if (!(lat >= minLat && lat <= maxLat && lng >= minLng && lng <= maxLng)) continue
    const key = `${Math.floor(lat / dLat)}:${Math.floor(lng / dLng)}`
    const c = cells.get(key)
    if (!c) cells.set(key, { n: 1, lat, lng, u: p.u[i], id: p.ids[i] })
    else {
      c.n++
      c.lat += lat
      c.lng += lng
      c.u = Math.max(c.u, p.u[i])
      c.id = Math.min(c.id, p.ids[i])
    }
  }
  const clusters: MapView['clusters'] = []
  const alone: number[] = []
  let total = 0
  for (const g of cells.values()) {
    total += g.n
    if (g.n === 1) alone.push(g.id)
    else clusters.push([round6(g.lat / g.n), round6(g.lng / g.n), g.n, g.u])
  }
  const { items, lines } = alone.length
    ? await itemRows(db, db('strings as s').whereIn('s.id', alone), detail)
    : { items: [], lines: [] }
  return { total, items, lines, clusters }
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6
