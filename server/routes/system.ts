import { admins } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { clientConfig, healthResponse, mailList, mailMessage } from '../../shared/schemas/system'
import { defineRoute, type RouteDef } from '../route-table'
import { HttpError } from '../errors'
import type { Config } from '../config'
import { getMail, listMail } from '../services/mail'
import { basemapSettings, tileSettings } from '../services/tiles'
import { demoAccountsSetting, demoBasemapSetting } from '../services/demo-settings'
import { basemap } from '../../shared/schemas/system'
import { publicBaseUrl } from '../public-url'

// The outbox shows every message the demo sent, invitation links included: only for the one role that
// could create those accounts anyway, only in demo mode, and never when mail goes to a real server.
function requireOutbox(config: Config): void {
  if (!config.DEMO_MODE || config.SMTP_URL)
    throw new HttpError(
      404,
      'not_found',
      'The mail outbox exists only in demo mode with the local mail fake.',
    )
}

export const systemRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/health',
    access: 'public',
    tag: 'system',
    summary: 'Liveness and database check',
    response: healthResponse,
    handler: async ({ deps, res }) => {
      try {
        await deps.db.raw('select 1')
        return { status: 'ok', db: 'ok' }
      } catch {
        res.status(503)
        return { status: 'degraded', db: 'down' }
      }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/config',
    access: 'public',
    tag: 'system',
    summary: 'Settings the client needs before sign-in',
    response: clientConfig,
    handler: async ({ deps }) => {
      const demo = deps.config.DEMO_MODE
      const accounts = demo ? await demoAccountsSetting(deps.db) : null
      return {
        appName: 'Lampwright',
        demoMode: demo,
        demoAccounts: accounts?.accounts ?? [],
        demoPassword: accounts?.password ?? null,
        tiles: tileSettings(deps.config),
        mailOutbox: demo && !deps.config.SMTP_URL,
        basemap: basemapSettings(deps.config),
        timeZone: deps.config.APP_TIME_ZONE,
        locale: deps.config.APP_LOCALE,
        publicUrl: deps.config.PUBLIC_URL?.trim() ? publicBaseUrl(deps.config) : null,
      }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/basemap',
    access: 'public',
    tag: 'system',
    summary: "The demo town's streets as GeoJSON, drawn when no TILE_URL is set (demo mode only)",
    response: basemap,
    handler: async ({ deps, res }) => {
      const streets = deps.config.DEMO_MODE ? await demoBasemapSetting(deps.db) : null
      if (!streets) throw new HttpError(404, 'not_found', 'Drawn streets exist only for the demo town.')
      res.setHeader('Cache-Control', 'public, max-age=3600')
      return streets
    },
  }),
  defineRoute({
    method: 'get',
    path: '/mail',
    access: admins,
    tag: 'system',
    summary: 'Messages caught by the local mail fake (demo only)',
    response: mailList,
    handler: async ({ deps }) => {
      requireOutbox(deps.config)
      return { items: await listMail(deps.db) }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/mail/:id',
    access: admins,
    tag: 'system',
    summary: 'One caught message (demo only)',
    params: idParam,
    response: mailMessage,
    handler: async ({ deps, params }) => {
      requireOutbox(deps.config)
      return getMail(deps.db, params.id)
    },
  }),
]
