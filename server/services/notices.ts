// In-app notices: written by the change that causes them (pass its transaction as `db`), read and
// marked read only by the user they are for.
import type { Db } from '../db'
import {
  NOTICE_BODY_MAX,
  NOTICE_LINK_MAX,
  NOTICE_TITLE_MAX,
  type Notice,
  type NoticeKind,
  type NoticesPage,
  type NoticesQuery,
  type NoticesReadBody,
} from '../../shared/schemas/notices'

export type { NoticeKind } from '../../shared/schemas/notices'

export interface NewNotice {
  kind: NoticeKind
  title: string
  body?: string
  /** An in-app path such as `/runs/12`; anything else is dropped. */
  link?: string
}

function cut(s: string, max: number): string {
  return s.length <= max ? s : `${s.slice(0, max - 1)}…`
}

/** One notice for each of `userIds` (duplicates and non-numbers skipped). Works inside a transaction. */
export async function addNotices(db: Db, userIds: number[], n: NewNotice): Promise<number> {
  const ids = [...new Set(userIds.filter((id) => Number.isInteger(id) && id > 0))]
  if (ids.length === 0) return 0
  const link = n.link && n.link.startsWith('/') && !n.link.startsWith('//') ? n.link : null
  const now = new Date()
  await db('notices').insert(
    ids.map((userId) => ({
      userId,
      kind: n.kind,
      title: cut(n.title, NOTICE_TITLE_MAX),
      body: n.body ? cut(n.body, NOTICE_BODY_MAX) : null,
      link: link && link.length <= NOTICE_LINK_MAX ? link : null,
      createdAt: now,
      readAt: null,
    })),
  )
  return ids.length
}

interface NoticeRow {
  id: number
  kind: NoticeKind
  title: string
  body: string | null
  link: string | null
  createdAt: Date
  readAt: Date | null
}

function toNotice(r: NoticeRow): Notice {
  return {
    id: r.id,
    kind: r.kind,
    title: r.title,
    body: r.body,
    link: r.link,
    createdAt: r.createdAt.toISOString(),
    readAt: r.readAt ? r.readAt.toISOString() : null,
  }
}

export async function unreadCount(db: Db, userId: number): Promise<number> {
  const row = (await db('notices').where({ userId }).whereNull('readAt').count({ n: '*' }).first()) as
    { n: number | string } | undefined
  return Number(row?.n ?? 0)
}

/** The user's own notices, newest first. */
export async function listNotices(db: Db, userId: number, q: NoticesQuery): Promise<NoticesPage> {
  const base = db('notices').where({ userId })
  if (q.unread) base.whereNull('readAt')
  const [rows, totalRow, unread] = await Promise.all([
    base
      .clone()
      .select('id', 'kind', 'title', 'body', 'link', 'createdAt', 'readAt')
      .orderBy([
        { column: 'createdAt', order: 'desc' },
        { column: 'id', order: 'desc' },
      ])
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    base.clone().count({ n: '*' }).first(),
    unreadCount(db, userId),
  ])
  return {
    items: (rows as NoticeRow[]).map(toNotice),
    total: Number((totalRow as { n: number | string } | undefined)?.n ?? 0),
    unread,
    page: q.page,
    pageSize: q.pageSize,
  }
}

/** Marks the user's own notices read; ids of other users' notices are ignored (never revealed). */
export async function markRead(
  db: Db,
  userId: number,
  body: NoticesReadBody,
): Promise<{ marked: number; unread: number }> {
  const q = db('notices').where({ userId }).whereNull('readAt')
  if ('ids' in body) q.whereIn('id', body.ids)
  const marked = Number(await q.update({ readAt: new Date() }))
  return { marked, unread: await unreadCount(db, userId) }
}
