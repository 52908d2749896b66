// The map's compact answer (issue 13 part 7): only what the map draws, as arrays rather than objects,
// and grouped on the server below a zoom level or above a count, so a district view over 20,000
// strings is a few hundred groups instead of thousands of strings. Every string in the box is in
// the answer: drawn alone in `items`, or counted in a group of `clusters`.
import { z } from 'zod'
import { bboxQuery } from './strings'
import type { StringStatus } from './string-states'

/** States from least to most urgent; a state travels as its index here, a group's as its worst. */
export const URGENCY_ORDER = [
  'lit',
  'watch',
  'safe',
  'replace',
  'dark',
] as const satisfies readonly StringStatus[]

/** From this zoom on, every string in the box comes alone (unless there are more than MAP_MAX_ITEMS). */
export const MAP_DETAIL_ZOOM = 15
/** More strings than this in the box come grouped whatever the zoom. */
export const MAP_MAX_ITEMS = 3000
/** A group gathers the strings of a square about this many screen pixels across. */
export const MAP_CELL_PX = 64

export const mapViewQuery = z.object({
  bbox: bboxQuery.shape.bbox.unwrap(),
  zoom: z.coerce.number().int().min(0).max(24),
})

const coord = z.number()
/** [id, lat, lng, state (index in URGENCY_ORDER), lamps out, replace now (0|1), asset tag, name] */
export const mapViewItem = z.tuple([
  z.number(),
  coord,
  coord,
  z.number(),
  z.number(),
  z.number(),
  z.string(),
  z.string(),
])
/** [lat, lng, strings in the group, most urgent state in it (index in URGENCY_ORDER)] */
export const mapViewCluster = z.tuple([coord, coord, z.number(), z.number()])

export const mapView = z.object({
  /** Strings in the box, alone or grouped. */
  total: z.number(),
  items: z.array(mapViewItem),
  /** The drawn line of each item that has one: [id, [[lng, lat], …]]. Only at MAP_DETAIL_ZOOM and beyond. */
  lines: z.array(z.tuple([z.number(), z.array(z.tuple([coord, coord]))])),
  clusters: z.array(mapViewCluster),
})
export type MapView = z.infer<typeof mapView>
