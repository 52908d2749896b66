import { z } from 'zod'
import {
  ISOLATION_PAGE_SIZE,
  REVIEW_NOTE_MAX,
  REVIEW_NOTE_MIN,
  findingFilters,
  isolationSorts,
  reviewStates,
} from '../vocab/isolations'
import { isolationSteps } from '../vocab/visits'

export const isolationQuery = z.object({
  review: z.enum([...reviewStates, 'all']).default('pending'),
  findings: z.enum(findingFilters).default('all'),
  sort: z.enum(isolationSorts).default('severity'),
  /** Started on these calendar days in the app's zone, both included. */
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(ISOLATION_PAGE_SIZE),
})
export type IsolationQuery = z.infer<typeof isolationQuery>

export const finding = z.object({
  code: z.string(),
  severity: z.enum(['serious', 'minor']),
  message: z.string(),
})
export type Finding = z.infer<typeof finding>

export const isolationAudit = z.object({
  id: z.number(),
  stringId: z.number().nullable(),
  assetTag: z.string().nullable(),
  stringName: z.string().nullable(),
  crewName: z.string().nullable(),
  userName: z.string(),
  lockId: z.string().nullable(),
  testerId: z.string().nullable(),
  state: z.enum(['open', 'isolated', 'restored', 'abandoned']),
  review: z.enum(reviewStates),
  reviewNote: z.string().nullable(),
  reviewedBy: z.string().nullable(),
  startedAt: z.string(),
  completedAt: z.string().nullable(),
  steps: z.array(
    z.object({ step: z.enum(isolationSteps), doneAt: z.string(), value: z.string().nullable() }),
  ),
  findings: z.array(finding),
})
export type IsolationAudit = z.infer<typeof isolationAudit>

export const isolationAuditList = z.object({
  /** One page of the records matching review + findings, in the asked order. */
  items: z.array(isolationAudit),
  /** Records matching the review and findings filters, over all pages. */
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  /** Under the review filter alone: every record, those with any finding, those with a serious one. */
  counts: z.object({ all: z.number(), any: z.number(), serious: z.number() }),
  withoutIsolation: z.array(
    z.object({
      visitId: z.number(),
      visitedAt: z.string(),
      assetTag: z.string(),
      userName: z.string(),
      reason: z.string().nullable(),
    }),
  ),
})

export const reviewBody = z
  .object({
    decision: z.enum(['approved', 'rejected']),
    note: z.string().trim().max(REVIEW_NOTE_MAX).optional(),
  })
  .refine((b) => b.decision === 'approved' || (b.note ?? '').length >= REVIEW_NOTE_MIN, {
    message: 'Say why the record is rejected, so the crew can put it right.',
    path: ['note'],
  })
