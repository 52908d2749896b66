import { fieldWorkers } from '../../shared/roles'
import { isolationBody, isolationResult, visitBody, visitResult } from '../../shared/schemas/visits'
import { defineRoute, type RouteDef } from '../route-table'
import { logVisit } from '../services/visits'
import { recordIsolation } from '../services/isolations'

export const visitRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/visits',
    access: fieldWorkers,
    tag: 'field',
    summary: 'Log a visit; a repeated Idempotency-Key answers 200 with the first visit',
    idempotency: 'required',
    body: visitBody,
    response: visitResult,
    status: 201,
    handler: async ({ deps, res, body, user, idempotencyKey }) => {
      const { created, visit } = await logVisit(deps.db, user, idempotencyKey, body)
      if (!created) res.status(200)
      return visit
    },
  }),
  defineRoute({
    method: 'post',
    path: '/isolations',
    access: fieldWorkers,
    tag: 'field',
    summary: 'Record an isolation and its steps; a repeated Idempotency-Key adds the steps it lacks',
    idempotency: 'required',
    body: isolationBody,
    response: isolationResult,
    status: 201,
    handler: async ({ deps, res, body, user, idempotencyKey }) => {
      const { created, isolation } = await recordIsolation(deps.db, user, idempotencyKey, body)
      if (!created) res.status(200)
      return { id: isolation.id, state: isolation.state, steps: isolation.steps }
    },
  }),
]
