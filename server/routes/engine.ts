import { everyone } from '../../shared/roles'
import {
  assessRequestSchema,
  assessResponseSchema,
  circuitRequestSchema,
  circuitResponseSchema,
  coldResistanceRequestSchema,
  coldResistanceResponseSchema,
  estimateShortedRequestSchema,
  estimateShortedResponseSchema,
  forecastRequestSchema,
  forecastResponseSchema,
} from '../../shared/schemas/engine'
import { assess, assessCircuit, coldResistance, estimateShorted } from '../../shared/engine/index'
import { MAX_FORECAST_COST } from '../../shared/engine/defaults'
import { defineRoute, type RouteDef } from '../route-table'
import { forecastInPool } from '../workers/heavy-jobs'

// The string engine over HTTP: the same pure functions the client runs offline.
export const engineRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/engine/assess',
    access: everyone,
    tag: 'engine',
    summary: 'Voltage share, stress factors and the replace-now verdict',
    body: assessRequestSchema,
    response: assessResponseSchema,
    handler: ({ body }) => assess(body),
  }),
  defineRoute({
    method: 'post',
    path: '/engine/forecast',
    access: everyone,
    tag: 'engine',
    summary: `Monte Carlo forecast of the failure cascade; at most ${MAX_FORECAST_COST} trials × lamps in circuit (413 beyond)`,
    body: forecastRequestSchema,
    response: forecastResponseSchema,
    handler: ({ body, user, res }) => forecastInPool(body, { userId: user.id, res }),
  }),
  defineRoute({
    method: 'post',
    path: '/engine/estimate-shorted',
    access: everyone,
    tag: 'engine',
    summary:
      'Shorted lamps from a clamp-meter reading: the range allows the meter (accuracy and one digit), the supply volts and the lamps (or a reference reading); a dead short is said plainly',
    body: estimateShortedRequestSchema,
    response: estimateShortedResponseSchema,
    handler: ({ body }) => estimateShorted(body),
  }),
  defineRoute({
    method: 'post',
    path: '/engine/cold-resistance',
    access: everyone,
    tag: 'engine',
    summary:
      'Expected cold resistance (from a healthy reference string, or hot ÷ the bench hot/cold ratio), the open and shorted thresholds, and what a reading points to',
    body: coldResistanceRequestSchema,
    response: coldResistanceResponseSchema,
    handler: ({ body }) => coldResistance(body),
  }),
  defineRoute({
    method: 'post',
    path: '/engine/circuit',
    access: everyone,
    tag: 'engine',
    summary: 'Circuit loading, switch-on peak against the breaker curve, energy',
    body: circuitRequestSchema,
    response: circuitResponseSchema,
    handler: ({ body }) => assessCircuit(body),
  }),
]
