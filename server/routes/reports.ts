import { rateLimit } from 'express-rate-limit'
import { refParam, reportBody, reportStatus, streetList } from '../../shared/schemas/reports'
import { defineRoute, type RouteDef } from '../route-table'
import { HttpError } from '../errors'
import { createReport, listStreets, reportStatus as loadStatus } from '../services/reports'

// The public form needs no account, so it is limited per address: 10 reports an hour.
const reportLimiter = () =>
  rateLimit({
    windowMs: 60 * 60_000,
    limit: 10,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(
        new HttpError(
          429,
          'rate_limited',
          'Thank you — we have several reports from you already. Try again later.',
        ),
      ),
  })

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
    before: () => [reportLimiter()],
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
