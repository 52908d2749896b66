import { roles } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { clientConfig, healthResponse, mailList, mailMessage } from '../../shared/schemas/system'
import { defineRoute, type RouteDef } from '../route-table'
import { HttpError } from '../errors'
import { demoAccounts, DEMO_PASSWORD } from '../../seeds/demo/accounts'
import { getMail, listMail } from '../services/mail'
import { tileSettings } from '../services/tiles'
import { demoBasemap } from '../services/basemap'
import { basemap } from '../../shared/schemas/system'

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
    handler: ({ deps }) => {
      const demo = deps.config.DEMO_MODE
      return {
        appName: 'Lampwright',
        demoMode: demo,
        demoAccounts: demo ? demoAccounts.map(({ email, role, name }) => ({ email, role, name })) : [],
        demoPassword: demo ? DEMO_PASSWORD : null,
        tiles: tileSettings(deps.config),
        mailOutbox: demo && !deps.config.SMTP_URL,
      }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/basemap',
    access: 'public',
    tag: 'system',
    summary: "The demo town's streets as GeoJSON, drawn when no TILE_URL is set",
    response: basemap,
    handler: ({ res }) => {
      res.setHeader('Cache-Control', 'public, max-age=3600')
      return demoBasemap()
    },
  }),
  defineRoute({
    method: 'get',
    path: '/mail',
    access: roles,
    tag: 'system',
    summary: 'Messages caught by the local mail fake (demo only)',
    response: mailList,
    handler: async ({ deps }) => {
      if (!deps.config.DEMO_MODE)
        throw new HttpError(404, 'not_found', 'The mail outbox exists only in demo mode.')
      return { items: await listMail(deps.db) }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/mail/:id',
    access: roles,
    tag: 'system',
    summary: 'One caught message (demo only)',
    params: idParam,
    response: mailMessage,
    handler: async ({ deps, params }) => {
      if (!deps.config.DEMO_MODE)
        throw new HttpError(404, 'not_found', 'The mail outbox exists only in demo mode.')
      return getMail(deps.db, params.id)
    },
  }),
]
