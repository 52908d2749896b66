import { z } from 'zod'
import { hhmm } from './common'
import { queueKinds } from '../vocab/queue'
import { reportNote } from './report-work'
import { needLine } from './stock'
import { statuses } from '../vocab/string-states'
import { stopStates } from '../stop-progress'

/** Where a stop stands after tonight's visits (../stop-progress.ts works it out). */
export const stopProgress = z.object({
  state: z.enum(stopStates),
  /** When the last visit (or the log that closed the stop) was made. */
  at: z.string().nullable(),
  /** The string as the last visit left it. */
  statusAfter: z.enum(statuses).nullable(),
  lampsOutAfter: z.number().nullable(),
  visits: z.number(),
})
export type StopProgress = z.infer<typeof stopProgress>

export const planBody = z.object({
  date: z.iso.date(),
  crewIds: z.array(z.number().int().positive()).min(1).max(20),
  itemIds: z.array(z.number().int().positive()).min(1).max(300),
  /** stops the supervisor fixed on a crew, in order */
  pins: z
    .array(
      z.object({
        itemId: z.number().int().positive(),
        crewId: z.number().int().positive(),
        index: z.number().int().min(0),
      }),
    )
    .default([]),
  speedKmh: z.number().min(3).max(90).optional(),
  detourFactor: z.number().min(1).max(3).optional(),
})
export type PlanBody = z.infer<typeof planBody>

export const runStop = z.object({
  itemId: z.number().nullable(),
  kind: z.enum(queueKinds).nullable(),
  summary: z.string(),
  stringId: z.number().nullable(),
  assetTag: z.string().nullable(),
  siteName: z.string().nullable(),
  lat: z.number(),
  lng: z.number(),
  arrive: hhmm,
  start: hhmm,
  depart: hhmm,
  travelMinutes: z.number(),
  serviceMinutes: z.number(),
  pinned: z.boolean(),
  window: z.object({ from: z.string(), to: z.string() }).nullable(),
  doneAt: z.string().nullable(),
  /** A hazard report's item: attended before anything else, logged from the stop. */
  emergency: z.boolean().optional(),
  /** Public reports still waiting on the stop's item: the reporters' words, place and photo. */
  reports: z.array(reportNote).optional(),
  /** On a saved run: where the stop stands after tonight's visits (stop-progress.ts). */
  progress: stopProgress.optional(),
})
export type RunStop = z.infer<typeof runStop>

export const crewRun = z.object({
  id: z.number().nullable(),
  crewId: z.number(),
  crewName: z.string(),
  date: z.string(),
  state: z.enum(['proposal', 'draft', 'published']),
  version: z.number(),
  publishedAt: z.string().nullable(),
  depot: z.object({ name: z.string(), lat: z.number(), lng: z.number() }),
  shiftStart: z.string(),
  shiftEnd: z.string(),
  platform: z.string().nullable(),
  stops: z.array(runStop),
  returnAt: z.string(),
  totalTravelMinutes: z.number(),
  totalServiceMinutes: z.number(),
  /** Plans only: lamp classes the stops need more of than the crew's van holds (stock). */
  stockShortfalls: z.array(needLine).optional(),
})
export type CrewRun = z.infer<typeof crewRun>

export const planResult = z.object({
  date: z.string(),
  /** where travel times came from: the routing service (ROUTING_URL) or straight line × detour */
  travelSource: z.enum(['straight_line', 'routing_service']),
  runs: z.array(crewRun),
  unassigned: z.array(
    z.object({ itemId: z.number(), summary: z.string(), reason: z.string(), message: z.string() }),
  ),
})
export type PlanResultView = z.infer<typeof planResult>

export const publishBody = z.object({
  date: z.iso.date(),
  runs: z
    .array(
      z.object({
        crewId: z.number().int().positive(),
        itemIds: z.array(z.number().int().positive()).max(200),
      }),
    )
    .min(1)
    .max(20),
  /** stops the supervisor pinned: saved pinned; the rest stay free for the next re-optimise */
  pinnedItemIds: z.array(z.number().int().positive()).max(300).default([]),
  speedKmh: z.number().min(3).max(90).optional(),
  detourFactor: z.number().min(1).max(3).optional(),
})
export const runsQuery = z.object({ date: z.iso.date().optional() })
export const runsList = z.object({ date: z.string(), runs: z.array(crewRun) })
/** A field user's run; one not on a crew gets `crew: null` and the names of who can add them. */
export const myRun = z.object({
  date: z.string(),
  run: crewRun.nullable(),
  crew: z.object({ id: z.number(), name: z.string() }).nullable(),
  askFrom: z.array(z.string()),
})

export const crewList = z.object({
  items: z.array(
    z.object({
      id: z.number(),
      name: z.string(),
      depotName: z.string(),
      depotLat: z.number(),
      depotLng: z.number(),
      shiftStart: z.string(),
      shiftEnd: z.string(),
      platform: z
        .object({ id: z.number(), name: z.string(), assetTag: z.string(), workingHeightM: z.number() })
        .nullable(),
      members: z.array(z.object({ id: z.number(), name: z.string(), email: z.string() })),
    }),
  ),
})
