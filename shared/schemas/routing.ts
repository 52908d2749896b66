// Request and response shapes of the route optimiser (tour) and the crew day planner, plain zod 4.
// Size limits are not part of the schemas: the server checks `tourRequestTooLarge` /
// `planRequestTooLarge` first and answers 413; anything these schemas reject is a 400.
import { z } from 'zod'
import { DEFAULT_DETOUR_FACTOR, DEFAULT_SPEED_KMH } from '../routing/plan-model'
import { MAX_TIME_LIMIT_MS } from '../routing/limits'
import { hhmm } from './common'

const latitude = z.number().min(-90).max(90)
const longitude = z.number().min(-180).max(180)

export const tourStopSchema = z.object({
  id: z.string().min(1).max(100),
  lat: latitude.optional(),
  lng: longitude.optional(),
  x: z.number().optional(),
  y: z.number().optional(),
})

export const tourRequestSchema = z
  .object({
    stops: z.array(tourStopSchema).min(1),
    /** travel cost from stop i to stop j, rows and columns in stop order; may be asymmetric */
    matrix: z.array(z.array(z.number().min(0))).optional(),
    start: z.string().min(1).optional(),
    timeLimitMs: z.number().int().min(1).max(MAX_TIME_LIMIT_MS).optional(),
  })
  .superRefine((req, ctx) => {
    const ids = new Set<string>()
    req.stops.forEach((stop, i) => {
      if (ids.has(stop.id))
        ctx.addIssue({ code: 'custom', message: 'Stop ids must be unique.', path: ['stops', i, 'id'] })
      ids.add(stop.id)
    })
    if (req.start !== undefined && !ids.has(req.start)) {
      ctx.addIssue({ code: 'custom', message: 'start must be the id of a stop.', path: ['start'] })
    }
    const n = req.stops.length
    if (req.matrix) {
      if (req.matrix.length !== n || req.matrix.some((row) => row.length !== n)) {
        ctx.addIssue({
          code: 'custom',
          message: `matrix must be square: ${n} rows of ${n} costs, one per stop.`,
          path: ['matrix'],
        })
      }
      return
    }
    const planar = req.stops.every((s) => s.x !== undefined && s.y !== undefined)
    const spherical = req.stops.every((s) => s.lat !== undefined && s.lng !== undefined)
    if (!planar && !spherical) {
      ctx.addIssue({
        code: 'custom',
        message: 'Give x/y for every stop, or lat/lng for every stop, or a travel matrix.',
        path: ['stops'],
      })
    }
  })

export const tourResultSchema = z.object({
  /** every stop id once, beginning with the start; the tour returns to it */
  order: z.array(z.string()),
  /** matrix units, planar units for x/y, or great-circle metres for lat/lng */
  cost: z.number(),
})

export type TourStopInput = z.infer<typeof tourStopSchema>
export type TourRequestInput = z.infer<typeof tourRequestSchema>
export type TourResultOutput = z.infer<typeof tourResultSchema>

const id = z.string().min(1).max(100)

export const planCrewSchema = z.object({
  id,
  name: z.string().min(1).max(200),
  depot: z.object({ lat: latitude, lng: longitude }),
  /** a shift ending at or before its start runs past midnight */
  shiftStart: hhmm,
  shiftEnd: hhmm,
  hasPlatform: z.boolean(),
})

export const planItemSchema = z.object({
  id,
  lat: latitude,
  lng: longitude,
  serviceMinutes: z
    .number()
    .int()
    .min(0)
    .max(24 * 60),
  /** allowed start times of the work */
  window: z.object({ from: hhmm, to: hhmm }).optional(),
  needsPlatform: z.boolean().optional(),
  /** higher is planned first and dropped last */
  priority: z.number().int().min(-1000).max(1000),
  pinnedCrewId: id.optional(),
  /** orders a crew's pinned items among themselves */
  pinnedIndex: z.number().int().min(0).optional(),
})

export const planSettingsSchema = z.object({
  speedKmh: z.number().positive().max(200).default(DEFAULT_SPEED_KMH),
  detourFactor: z.number().min(1).max(5).default(DEFAULT_DETOUR_FACTOR),
  /** travel minutes over [depots in crew order..., items in item order...] */
  matrixMinutes: z.array(z.array(z.number().min(0))).optional(),
})

export const planRequestSchema = z
  .object({
    crews: z.array(planCrewSchema).min(1),
    items: z.array(planItemSchema),
    settings: planSettingsSchema.prefault({}),
  })
  .superRefine((req, ctx) => {
    const crewIds = new Set<string>()
    req.crews.forEach((crew, i) => {
      if (crewIds.has(crew.id))
        ctx.addIssue({ code: 'custom', message: 'Crew ids must be unique.', path: ['crews', i, 'id'] })
      crewIds.add(crew.id)
    })
    const itemIds = new Set<string>()
    req.items.forEach((item, i) => {
      if (itemIds.has(item.id))
        ctx.addIssue({ code: 'custom', message: 'Item ids must be unique.', path: ['items', i, 'id'] })
      itemIds.add(item.id)
      if (item.pinnedCrewId !== undefined && !crewIds.has(item.pinnedCrewId)) {
        ctx.addIssue({
          code: 'custom',
          message: 'Pinned to an unknown crew.',
          path: ['items', i, 'pinnedCrewId'],
        })
      }
      if (item.pinnedIndex !== undefined && item.pinnedCrewId === undefined) {
        ctx.addIssue({
          code: 'custom',
          message: 'pinnedIndex needs pinnedCrewId.',
          path: ['items', i, 'pinnedIndex'],
        })
      }
    })
    const matrix = req.settings.matrixMinutes
    const n = req.crews.length + req.items.length
    if (matrix && (matrix.length !== n || matrix.some((row) => row.length !== n))) {
      ctx.addIssue({
        code: 'custom',
        message: `matrixMinutes must be square: ${n} rows of ${n}, depots in crew order then items.`,
        path: ['settings', 'matrixMinutes'],
      })
    }
  })

const clock = z.string().regex(/^\d{2}:\d{2}$/)

export const planResultSchema = z.object({
  runs: z.array(
    z.object({
      crewId: z.string(),
      stops: z.array(
        z.object({
          itemId: z.string(),
          arrive: clock,
          start: clock,
          depart: clock,
          travelMinutes: z.number(),
        }),
      ),
      returnAt: clock,
      totalTravelMinutes: z.number(),
      totalServiceMinutes: z.number(),
    }),
  ),
  unassigned: z.array(
    z.object({
      itemId: z.string(),
      reason: z.enum(['outside_shift', 'window_unreachable', 'needs_platform', 'shift_full']),
      message: z.string(),
    }),
  ),
})

export type PlanRequestInput = z.input<typeof planRequestSchema>
export type PlanRequest = z.output<typeof planRequestSchema>
export type PlanResultOutput = z.infer<typeof planResultSchema>
