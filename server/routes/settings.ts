import { admins, everyone } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import {
  stringTypeList,
  stringTypePatch,
  stringTypeUpdated,
  systemSettings,
} from '../../shared/schemas/types'
import { defineRoute, type RouteDef } from '../route-table'
import { listStringTypes, updateStringType } from '../services/string-types'
import { audited } from '../services/audit'
import { basemapSettings } from '../services/tiles'

export const settingsRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/string-types',
    access: everyone,
    tag: 'settings',
    summary: 'String types with lamp classes, thresholds and life model',
    response: stringTypeList,
    handler: async ({ deps }) => ({ items: await listStringTypes(deps.db) }),
  }),
  defineRoute({
    method: 'patch',
    path: '/string-types/:id',
    access: admins,
    tag: 'settings',
    summary: "Change a type's replace-now threshold or life model; its strings are restated at once",
    params: idParam,
    body: stringTypePatch,
    response: stringTypeUpdated,
    handler: ({ deps, params, body, user, req }) =>
      audited(
        deps.db,
        (trx) => updateStringType(trx, params.id, body),
        () => ({
          userId: user.id,
          action: 'update',
          entity: 'string_type',
          entityId: params.id,
          details: body,
          requestId: String(req.id),
        }),
      ),
  }),
  defineRoute({
    method: 'get',
    path: '/settings/system',
    access: admins,
    tag: 'settings',
    summary: 'Where tiles, mail and travel times come from (set by environment)',
    response: systemSettings,
    handler: ({ deps }) => ({
      tiles: (() => {
        const b = basemapSettings(deps.config)
        const source = {
          pmtiles: 'basemap_file',
          tile_server: 'tile_server',
          demo: 'demo_basemap',
          none: 'none',
        } as const
        return {
          source: source[b.kind],
          url: b.kind === 'pmtiles' ? (deps.config.BASEMAP_FILE ?? null) : b.url,
        }
      })(),
      mail: { transport: deps.config.SMTP_URL ? 'smtp' : 'local_fake', from: deps.config.MAIL_FROM },
      routing: {
        source: deps.config.ROUTING_URL ? 'routing_service' : 'straight_line',
        url: deps.config.ROUTING_URL ?? null,
      },
      demoMode: deps.config.DEMO_MODE,
      sessionHours: deps.config.SESSION_HOURS,
    }),
  }),
]
