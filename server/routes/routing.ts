import { planners } from '../../shared/roles'
import { tourRequestSchema, tourResultSchema } from '../../shared/schemas/routing'
import { solveTour } from '../../shared/routing/index'
import {
  MAX_STOPS_WITH_COORDINATES,
  MAX_STOPS_WITH_MATRIX,
  tourRequestTooLarge,
} from '../../shared/routing/limits'
import { defineRoute, type RouteDef } from '../route-table'
import { HttpError } from '../errors'

export const routingRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/routing/solve',
    access: planners,
    tag: 'routing',
    summary: 'Shortest closed tour through the stops',
    body: tourRequestSchema,
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
    handler: ({ body }) => solveTour(body),
  }),
]
