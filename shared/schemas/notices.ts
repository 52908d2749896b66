// In-app notices: what concerns one user, shown under the bell in the header until read.
import { z } from 'zod'

export const NOTICE_KINDS = [
  'isolation_rejected',
  'run_changed',
  'certificate_expiring',
  'report_assigned',
  'low_stock',
] as const
export const noticeKind = z.enum(NOTICE_KINDS)
export type NoticeKind = z.infer<typeof noticeKind>

export const NOTICE_PAGE_SIZE = 20
/** Longest title and body kept; longer text is cut with an ellipsis (one place for the rule). */
export const NOTICE_TITLE_MAX = 200
export const NOTICE_BODY_MAX = 1000
export const NOTICE_LINK_MAX = 300

export const noticesQuery = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(NOTICE_PAGE_SIZE),
  /** Only the unread ones. */
  unread: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
})
export type NoticesQuery = z.infer<typeof noticesQuery>

export const notice = z.object({
  id: z.number(),
  kind: noticeKind,
  title: z.string(),
  body: z.string().nullable(),
  /** An in-app path such as /runs/12, or null. */
  link: z.string().nullable(),
  /** ISO time (UTC). */
  createdAt: z.string(),
  readAt: z.string().nullable(),
})
export type Notice = z.infer<typeof notice>

export const noticesPage = z.object({
  items: z.array(notice),
  total: z.number(),
  unread: z.number(),
  page: z.number(),
  pageSize: z.number(),
})
export type NoticesPage = z.infer<typeof noticesPage>

/** Mark the given notices read, or every one of the user's notices with `all: true`. */
export const noticesReadBody = z.union([
  z.object({ ids: z.array(z.number().int().positive()).min(1).max(100) }).strict(),
  z.object({ all: z.literal(true) }).strict(),
])
export type NoticesReadBody = z.infer<typeof noticesReadBody>

export const noticesReadResponse = z.object({ marked: z.number(), unread: z.number() })
export type NoticesReadResponse = z.infer<typeof noticesReadResponse>
