import { everyone } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import {
  bboxQuery,
  circuitLoadResult,
  mapList,
  stringDetail,
  stringForecast,
  tagLookup,
  tagParam,
} from '../../shared/schemas/strings'
import { defineRoute, type RouteDef } from '../route-table'
import { findByTag, listForMap } from '../services/strings'
import { stringDetailAndRow, wholeForecast } from '../services/string-detail'
import { READ_ROW } from './estate-row'
import { circuitLoad } from '../services/circuit-load'
import { mapView as loadMapView } from '../services/map-view'
import { mapView, mapViewQuery } from '../../shared/schemas/map-view'

export const stringRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/strings',
    access: everyone,
    tag: 'strings',
    summary: 'Strings in a bounding box, or found by tag or street',
    query: bboxQuery,
    response: mapList,
    handler: ({ deps, query }) => listForMap(deps.db, query),
  }),
  defineRoute({
    method: 'get',
    path: '/strings/map',
    access: everyone,
    tag: 'strings',
    summary:
      'The map in a bounding box at a zoom: each string alone from zoom 15 on, else grouped on the server; compact arrays',
    query: mapViewQuery,
    response: mapView,
    handler: ({ deps, query }) => loadMapView(deps.db, query.bbox, query.zoom),
  }),
  defineRoute({
    method: 'get',
    path: '/strings/by-tag/:tag',
    access: everyone,
    tag: 'strings',
    summary: 'Find a string by its asset tag (QR label)',
    params: tagParam,
    response: tagLookup,
    handler: ({ deps, params }) => findByTag(deps.db, params.tag),
  }),
  defineRoute({
    method: 'get',
    path: '/strings/:id',
    access: everyone,
    tag: 'strings',
    summary: 'One string with its assessment, lead forecast (72 h chance, likely dark day) and history',
    params: idParam,
    response: stringDetail,
    handler: async ({ deps, params, res }) => {
      const { detail, row } = await stringDetailAndRow(deps.db, params.id)
      // The estate's editable fields (routes/estate.ts adds them) come from this same row.
      res.locals[READ_ROW] = row
      return detail
    },
  }),
  defineRoute({
    method: 'get',
    path: '/strings/:id/forecast',
    access: everyone,
    tag: 'strings',
    summary: "The engine's whole forecast of one string as it is now (failures, chart, chances)",
    params: idParam,
    response: stringForecast,
    handler: ({ deps, params }) => wholeForecast(deps.db, params.id),
  }),
  defineRoute({
    method: 'get',
    path: '/circuits/:id/load',
    access: everyone,
    tag: 'strings',
    summary: 'Running and switch-on current of every string on a circuit against its breaker, RCD and energy',
    params: idParam,
    response: circuitLoadResult,
    handler: ({ deps, params }) => circuitLoad(deps.db, params.id),
  }),
]
