import { fieldRoles } from '../../shared/roles'
import { isolationBody, isolationResult, visitBody, visitResult } from '../../shared/schemas/visits'
import { defineRoute, type RouteDef } from '../route-table'
import { requireIdempotencyKey } from '../middleware/idempotency'
import { logVisit } from '../services/visits'
import { recordIsolation } from '../services/isolations'

export const visitRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/visits',
    access: fieldRoles,
    tag: 'field',
    summary: 'Log a visit (Idempotency-Key header required)',
    body: visitBody,
    response: visitResult,
    status: 201,
    handler: async ({ deps, req, res, body, user }) => {
      const { created, visit } = await logVisit(deps.db, user, requireIdempotencyKey(req), body)
      if (!created) res.status(200)
      return visit
    },
  }),
  defineRoute({
    method: 'post',
    path: '/isolations',
    access: fieldRoles,
    tag: 'field',
    summary: 'Record an isolation and its steps (Idempotency-Key header required)',
    body: isolationBody,
    response: isolationResult,
    status: 201,
    handler: async ({ deps, req, res, body, user }) => {
      const { created, isolation } = await recordIsolation(deps.db, user, requireIdempotencyKey(req), body)
      if (!created) res.status(200)
      return { id: isolation.id, state: isolation.state, steps: isolation.steps }
    },
  }),
]
