// Opening and closing queue items. One item is open per kind and subject (its open_key); every close
// goes through closeItems, which also moves a public report out of `received`, so no refresh reopens it.
import type { Db } from '../../db'
import type { QueueKind } from '../../../shared/schemas/queue'
import type { ReportState } from '../../../shared/schemas/reports'
import { dueAfter } from '../../../shared/local-time'
import { settleReportsOfItems } from './report-states'

/** Work still waiting: open, or snoozed until a time. */
export const ACTIVE = ['open', 'snoozed'] as const

export interface OpenItem {
  kind: QueueKind
  subject: string
  severity: 'emergency' | 'standard'
  summary: string
  stringId?: number | null
  reportId?: number | null
  certificateId?: number | null
  siteId?: number | null
  clientId?: number | null
  openedAt?: Date
  dueBy?: Date
}

const isDuplicate = (err: unknown) => (err as { code?: string }).code === 'ER_DUP_ENTRY'

/** Opens a queue item unless one is already open for the same kind and subject; returns its id. */
export async function openItem(db: Db, item: OpenItem, now = new Date()): Promise<number> {
  const openKey = `${item.kind}:${item.subject}`
  const existing = await db('queueItems').where({ openKey }).first('id')
  if (existing) return existing.id
  let dueBy = item.dueBy
  if (!dueBy && item.clientId) {
    const c = await db('clients')
      .where({ id: item.clientId })
      .first('responseEmergencyHours', 'responseStandardHours')
    const hours = item.severity === 'emergency' ? c.responseEmergencyHours : c.responseStandardHours
    // Contract hours are elapsed hours: across a clock change the local due time moves by an hour.
    dueBy = dueAfter(item.openedAt ?? now, hours)
  }
  try {
    const [id] = await db('queueItems').insert({
      kind: item.kind,
      openKey,
      stringId: item.stringId ?? null,
      reportId: item.reportId ?? null,
      certificateId: item.certificateId ?? null,
      siteId: item.siteId ?? null,
      clientId: item.clientId ?? null,
      severity: item.severity,
      state: 'open',
      openedAt: item.openedAt ?? now,
      dueBy: dueBy ?? dueAfter(now, 36),
      summary: item.summary.slice(0, 255),
    })
    return id
  } catch (err) {
    // Opened at the same moment elsewhere (the job and a new report): that item is the one. A locking
    // read: a plain one inside a transaction sees only what was committed before its first read.
    if (!isDuplicate(err)) throw err
    return (await db('queueItems').where({ openKey }).forShare().first('id')).id
  }
}

export interface CloseHow {
  now?: Date
  /** The visit that fixed it. */
  visitId?: number | null
  /** A supervisor's reason for closing without a visit. */
  reason?: string | null
  /** What a public report's status page says once its item is closed. */
  reportState?: ReportState
  /** Words for the reporter's status page (a supervisor's, for not ours / duplicate). */
  publicNote?: string | null
}

/** Closes the open or snoozed items among `ids`; their public reports leave `received` in the same commit. */
export async function closeItems(db: Db, ids: number[], how: CloseHow = {}): Promise<number[]> {
  if (!ids.length) return []
  const now = how.now ?? new Date()
  const rows = await db('queueItems').whereIn('id', ids).whereIn('state', ACTIVE).select('id')
  const closing = rows.map((r) => r.id as number)
  if (!closing.length) return []
  await db('queueItems')
    .whereIn('id', closing)
    .update({
      state: 'closed',
      openKey: null,
      closedAt: now,
      closedByVisitId: how.visitId ?? null,
      closeReason: how.reason ?? null,
    })
  // Their public reports move on in this commit, with history and the reporter's "fixed" e-mail.
  await settleReportsOfItems(db, closing, how.reportState ?? 'fixed', now, { publicNote: how.publicNote })
  return closing
}
