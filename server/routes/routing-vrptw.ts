import { planners } from '../../shared/roles'
import { vrptwRequestSchema, vrptwResultSchema } from '../../shared/schemas/routing-vrptw'
import { MAX_VRPTW_STOPS, vrptwRequestTooLarge } from '../../shared/routing/vrptw/limits'
import { MAX_TOUR_COST } from '../../shared/routing/limits'
import { defineRoute, type RouteDef } from '../route-table'
import { HttpError } from '../errors'
import { solveVrptwInPool } from '../workers/heavy-jobs'

export const routingVrptwRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/routing/solve-vrptw',
    access: planners,
    tag: 'routing',
    summary:
      `Routes for several vehicles with time windows and capacity: fewest unserved stops, then shortest; ` +
      `at most ${MAX_VRPTW_STOPS} stops and ${MAX_TOUR_COST} stops × time-limit ms (413 beyond)`,
    body: vrptwRequestSchema,
    bodyCheck: 'handler',
    response: vrptwResultSchema,
    before: () => [
      (req, _res, next) => {
        if (req.body && vrptwRequestTooLarge(req.body)) {
          return next(new HttpError(413, 'too_many_stops', `At most ${MAX_VRPTW_STOPS} stops per request.`))
        }
        next()
      },
    ],
    // The raw body: a pool thread checks it (server/workers/vrptw-task.ts).
    handler: ({ req, user, res }) => solveVrptwInPool(req.body, { userId: user.id, res }),
  }),
]
