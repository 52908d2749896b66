import { planners } from '../../shared/roles'
import { tourRequestSchema, tourResultSchema } from '../../shared/schemas/routing'
import {
  MAX_STOPS_WITH_COORDINATES,
  MAX_STOPS_WITH_MATRIX,
  MAX_TOUR_COST,
  tourRequestTooLarge,
} from '../../shared/routing/limits'
import { defineRoute, type RouteDef } from '../route-table'
import { HttpError } from '../errors'
import { solveTourInPool } from '../workers/heavy-jobs'

export const routingRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/routing/solve',
    access: planners,
    tag: 'routing',
    summary: `Shortest closed tour through the stops; at most ${MAX_TOUR_COST} stops × time-limit ms (413 beyond)`,
    body: tourRequestSchema,
    bodyCheck: 'handler',
    response: tourResultSchema,
    before: () => [
      (req, _res, next) => {
        if (req.body && tourRequestTooLarge(req.body)) {
          return next(
            new HttpError(
              413,
              'too_many_stops',
              `At most ${MAX_STOPS_WITH_MATRIX} stops with a matrix and ${MAX_STOPS_WITH_COORDINATES} with coordinates.`,
            ),
          )
        }
        next()
      },
    ],
    // The raw body: a pool thread validates it against tourRequestSchema.
    handler: ({ req, user, res }) => solveTourInPool(req.body, { userId: user.id, res }),
  }),
]
