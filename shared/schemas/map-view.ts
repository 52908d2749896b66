// The map's compact answer (issue 13 part 7): only what the map draws, as arrays rather than objects,
// and grouped on the server below a zoom level or above a count, so a district view over 20,000
// strings is a few hundred groups instead of thousands of strings. Every string in the box is in
// the answer: drawn alone in `items`, or counted in a group of `clusters`.
import { z } from 'zod'
import { bboxQuery } from './strings'

// The states' order (URGENCY_ORDER) and the grouping limits are in ../vocab/map-view.ts.

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
