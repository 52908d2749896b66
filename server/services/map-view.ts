// The map's compact answer (shared/schemas/map-view.ts). Below MAP_DETAIL_ZOOM, or with more than
// MAP_MAX_ITEMS strings in the box, strings are grouped in SQL on a fixed grid of squares about
// MAP_CELL_PX screen pixels across at that zoom (fixed to the globe, not to the box, so a pan keeps
// the same groups); a square holding one string sends that string. The (lat, lng) index serves
// the box.
import type { Db } from '../db'
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

const parseLine = (v: unknown) =>
  (v == null ? null : typeof v === 'string' ? JSON.parse(v) : v) as [number, number][] | null

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
      const line = parseLine(r.line)
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
  const groups = await inBox(db, bbox)
    .select(
      db.raw('count(*) as n'),
      db.raw('avg(s.lat) as lat'),
      db.raw('avg(s.lng) as lng'),
      db.raw(`max(${urgencyCase}) as u`),
      db.raw('min(s.id) as id'),
    )
    .groupByRaw('floor(s.lat / ?), floor(s.lng / ?)', [dLat, dLng])
    // Groups in any order: MariaDB would otherwise sort them by the grouping.
    .orderByRaw('null')
  const clusters: MapView['clusters'] = []
  const alone: number[] = []
  let total = 0
  for (const g of groups) {
    const n = Number(g.n)
    total += n
    if (n === 1) alone.push(Number(g.id))
    else clusters.push([round6(Number(g.lat)), round6(Number(g.lng)), n, Number(g.u)])
  }
  const { items, lines } = alone.length
    ? await itemRows(db, db('strings as s').whereIn('s.id', alone), detail)
    : { items: [], lines: [] }
  return { total, items, lines, clusters }
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6
