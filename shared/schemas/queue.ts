import { z } from 'zod'
import { statusSchema } from './string-states'
import { queueKinds } from '../vocab/queue'
import { reportClosedStates } from '../vocab/reports'
import { reportNote } from './report-work'

export const queueItemStates = ['open', 'snoozed', 'closed', 'merged'] as const

export const queueQuery = z.object({
  clientId: z.coerce.number().int().positive().optional(),
  siteId: z.coerce.number().int().positive().optional(),
  kind: z.enum(queueKinds).optional(),
  crewId: z.coerce.number().int().positive().optional(),
  state: z.enum(['open', 'snoozed', 'closed', 'all']).default('open'),
})

export const scoreParts = z.object({ risk: z.number(), importance: z.number(), clock: z.number() })

export const queueItem = z.object({
  id: z.number(),
  kind: z.enum(queueKinds),
  severity: z.enum(['emergency', 'standard']),
  state: z.enum(queueItemStates),
  summary: z.string(),
  openedAt: z.string(),
  dueBy: z.string(),
  hoursLeft: z.number(),
  overdue: z.boolean(),
  score: z.number(),
  scoreParts: scoreParts,
  why: z.array(z.string()),
  snoozedUntil: z.string().nullable(),
  snoozeReason: z.string().nullable(),
  /** Why a supervisor closed it without a visit. */
  closeReason: z.string().nullable(),
  mergedCount: z.number(),
  string: z
    .object({
      id: z.number(),
      assetTag: z.string(),
      name: z.string(),
      status: statusSchema,
      lampsOut: z.number(),
    })
    .nullable(),
  site: z
    .object({
      id: z.number(),
      name: z.string(),
      accessFrom: z.string().nullable(),
      accessTo: z.string().nullable(),
    })
    .nullable(),
  client: z.object({ id: z.number(), name: z.string() }).nullable(),
  lat: z.number().nullable(),
  lng: z.number().nullable(),
  reportRef: z.string().nullable(),
  plannedCrewId: z.number().nullable(),
  /** Public reports still waiting on this item: the reporters' words, place and photo. */
  reports: z.array(reportNote),
})
export type QueueItem = z.infer<typeof queueItem>
export const queueList = z.object({ items: z.array(queueItem), refreshedAt: z.string() })

export const snoozeBody = z.object({
  until: z.iso.datetime({ offset: true }),
  reason: z.string().trim().min(3, 'Give a reason.').max(255),
})
export const mergeBody = z.object({
  into: z.number().int().positive(),
  ids: z.array(z.number().int().positive()).min(1).max(50),
})
export const closeBody = z.object({
  reason: z.string().trim().min(3).max(255),
  /** For a public-report item: what the reporter's status page says now. Fixed when not given. */
  reportState: z.enum(reportClosedStates).optional(),
})
/** A snoozed item woken early: open again now. */
export const wakeResult = z.object({ id: z.number(), state: z.literal('open') })

export const refreshResult = z.object({ opened: z.number(), open: z.number() })
