// The map's compact answer (shared/schemas/map-view.ts). Below MAP_DETAIL_ZOOM, or with more than
// MAP_MAX_ITEMS strings in the box, strings are grouped on a fixed grid of squares about MAP_CELL_PX
// screen pixels across at that zoom (fixed to the globe, not to the box, so a pan keeps the same
// groups); a square holding one string sends that string, read fresh. The grouping works from a
// snapshot of every live string's position and state, at most POSITIONS_TTL_MS old, kept by each
// process: grouping thousands of rows in SQL for every zoomed-out pan cost ~20 ms of MariaDB per
// request, this a few ms of JavaScript. The (lat, lng) index serves the street-zoom box.
import type { Db } from '../db'
import { lineOf } from './strings'
import {
  MAP_CELL_PX,
  MAP_DETAIL_ZOOM,
  MAP_MAX_ITEMS,
  URGENCY_ORDER,
  type MapView,
} from '../../shared/schemas/map-view'

type Box = [number, number, number, number]

const urgencyCase = `case s.status ${URGENCY_ORDER.map((st, i) => `when '${st}' then ${i}`).join(' ')} else 0 end`

const inBox = (db: Db, [minLng, minLat, maxLng, maxLat]: Box) =>
  db('strings as s')
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
  for (let i = 0; i < p.ids.length; i++) {
    const lat = p.lat[i]
    const lng = p.lng[i]
    if (lat < minLat || lat > maxLat || lng < minLng || lng > maxLng) continue
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

/** How old the grouping's snapshot of positions may be: a zoomed-out mark's state lags by at most this. */
export const POSITIONS_TTL_MS = 5_000

interface Positions {
  ids: Int32Array
  lat: Float64Array
  lng: Float64Array
  u: Uint8Array
}

let snapshot: { db: Db; at: number; load: Promise<Positions> } | null = null

/** Every live string's id, position and state, read once per POSITIONS_TTL_MS by this process. */
function positions(db: Db): Promise<Positions> {
  const now = Date.now()
  if (snapshot && snapshot.db === db && now - snapshot.at < POSITIONS_TTL_MS) return snapshot.load
  const load = db('strings as s')
    .whereNull('s.archivedAt')
    .select('s.id', 's.lat', 's.lng', db.raw(`${urgencyCase} as u`))
    .then((rows) => {
      const out: Positions = {
        ids: new Int32Array(rows.length),
        lat: new Float64Array(rows.length),
        lng: new Float64Array(rows.length),
        u: new Uint8Array(rows.length),
      }
      rows.forEach((r, i) => {
        out.ids[i] = r.id
        out.lat[i] = r.lat
        out.lng[i] = r.lng
        out.u[i] = Number(r.u)
      })
      return out
    })
  snapshot = { db, at: now, load }
  // A failed read is not kept: the next request tries again.
  load.catch(() => {
    if (snapshot?.load === load) snapshot = null
  })
  return load
}
