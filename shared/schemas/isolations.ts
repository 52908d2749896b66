import { z } from 'zod'
import { isolationSteps } from './visits'

export const reviewStates = ['pending', 'approved', 'rejected'] as const

export const isolationQuery = z.object({
  review: z.enum([...reviewStates, 'all']).default('pending'),
  limit: z.coerce.number().int().min(1).max(500).default(100),
})

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
  items: z.array(isolationAudit),
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
    note: z.string().trim().max(500).optional(),
  })
  .refine((b) => b.decision === 'approved' || (b.note ?? '').length >= 5, {
    message: 'Say why the record is rejected, so the crew can put it right.',
    path: ['note'],
  })
