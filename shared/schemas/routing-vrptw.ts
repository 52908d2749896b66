// Request and response of POST /api/v1/routing/solve-vrptw, plain zod 4. The server checks the stop
// count first (413 beyond MAX_VRPTW_STOPS) and non-finite numbers, duplicate ids and stops no vehicle
// can reach in time (400 with the ids, shared/routing/vrptw/validate.ts); the rest is this schema.
import { z } from 'zod'
import { MAX_VRPTW_TIME_LIMIT_MS } from '../routing/vrptw/limits'

const time = z.number().min(0)

export const vrptwRequestSchema = z
  .object({
    depot: z.object({ x: z.number(), y: z.number(), ready: time, due: time }),
    vehicles: z.object({ count: z.number().int().min(1).max(1000), capacity: z.number().min(0) }),
    stops: z
      .array(
        z.object({
          id: z.string().min(1).max(100),
          x: z.number(),
          y: z.number(),
          demand: z.number().min(0),
          ready: time,
          due: time,
          service: z.number().min(0),
        }),
      )
      .min(1),
    timeLimitMs: z.number().int().min(1).max(MAX_VRPTW_TIME_LIMIT_MS).optional(),
    /** same seed and iteration budget → same routes */
    seed: z.number().int().min(0).max(4294967295).optional(),
    maxIterations: z.number().int().min(1).max(1_000_000).optional(),
  })
  .superRefine((req, ctx) => {
    if (req.depot.due < req.depot.ready)
      ctx.addIssue({
        code: 'custom',
        message: 'depot.due must not be before depot.ready.',
        path: ['depot', 'due'],
      })
    req.stops.forEach((s, i) => {
      if (s.due < s.ready)
        ctx.addIssue({ code: 'custom', message: 'due must not be before ready.', path: ['stops', i, 'due'] })
    })
  })

export const vrptwResultSchema = z.object({
  /** stop ids in visiting order, one list per route used */
  routes: z.array(z.array(z.string())),
  /** total Euclidean distance, depot to depot */
  distance: z.number(),
  unserved: z.array(z.object({ id: z.string(), reason: z.enum(['unreachable', 'no_room']) })),
})

export type VrptwRequestInput = z.infer<typeof vrptwRequestSchema>
export type VrptwResultOutput = z.infer<typeof vrptwResultSchema>
