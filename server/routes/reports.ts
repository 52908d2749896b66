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
    summary: 'Report a fault without an account',
    body: reportBody,
    response: reportStatus,
    status: 201,
    before: (deps) => [limitByAddress(deps.db, LIMITS.report)],
    handler: ({ deps, body, req }) => createReport(deps.db, body, req.ip ?? ''),
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
