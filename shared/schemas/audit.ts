// The audit log as the API reads it: who did what to which record, when, with the record before
// and after where the change stored both (estate edits), else the change as it was asked for.
import { z } from 'zod'

export const AUDIT_PAGE_SIZE = 25

export const auditQuery = z.object({
  /** The record's kind as the log names it: client, string, user, queue_item, job… */
  entity: z
    .string()
    .trim()
    .regex(/^[a-z_]{1,40}$/, 'a record kind such as client or string')
    .optional(),
  entityId: z.coerce.number().int().positive().optional(),
  userId: z.coerce.number().int().positive().optional(),
  /** Calendar days in the app's zone, both included. */
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(AUDIT_PAGE_SIZE),
})
export type AuditQuery = z.infer<typeof auditQuery>

export const auditEntry = z.object({
  id: z.number(),
  /** ISO time (UTC). */
  at: z.string(),
  user: z.object({ id: z.number(), name: z.string(), role: z.string() }).nullable(),
  action: z.string(),
  entity: z.string(),
  entityId: z.number().nullable(),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
  requestId: z.string().nullable(),
})
export type AuditEntry = z.infer<typeof auditEntry>

export const auditPage = z.object({
  items: z.array(auditEntry),
  /** Entries matching the filters, over all pages. */
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  /** Every record kind in the log, for the filter's menu. */
  entities: z.array(z.string()),
})
export type AuditPage = z.infer<typeof auditPage>
