// The map's compact answer (schemas/map-view.ts): how a state travels in it and when strings come
// grouped.
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
