import { refParam, reportBody, reportStatus, streetList } from '../../shared/schemas/reports'
import { defineRoute, type RouteDef } from '../route-table'
import { createReport, listStreets, reportStatus as loadStatus } from '../services/reports'
import { LIMITS, limitByAddress } from '../services/rate-limits'

// The public form and the status look-up need no account, so both are limited per address.
export const reportRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/reports',
    access: 'public',
    tag: 'public',
    summary:
      'Report a fault without an account; a repeated Idempotency-Key answers 200 with the first report',
    // Optional: the public form sends one made when it opens; other senders may leave it out.
    idempotency: 'optional',
    body: reportBody,
    response: reportStatus,
    status: 201,
    before: (deps) => [limitByAddress(deps.db, LIMITS.report)],
    handler: async ({ deps, body, req, res, idempotencyKey }) => {
      const { created, report } = await createReport(deps.db, body, req.ip ?? '', idempotencyKey)
      if (!created) res.status(200)
      return report
    },
  }),
  defineRoute({
    method: 'get',
    path: '/reports/:ref',
    access: 'public',
    tag: 'public',
    summary: 'Status of a public report by its reference',
    params: refParam,
    response: reportStatus,
    before: (deps) => [limitByAddress(deps.db, LIMITS.statusLookup)],
    handler: ({ deps, params }) => loadStatus(deps.db, params.ref),
  }),
  defineRoute({
    method: 'get',
    path: '/public/streets',
    access: 'public',
    tag: 'public',
    summary: 'Streets and venues with our lights, for the report form',
    response: streetList,
    handler: async ({ deps }) => ({ items: await listStreets(deps.db) }),
  }),
]
