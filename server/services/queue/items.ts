// Opening and closing queue items. One item is open per kind and subject (its open_key); every close
// goes through closeItems, which also moves a public report out of `received`, so no refresh reopens it.
import type { Db } from '../../db'
import type { QueueKind } from '../../../shared/vocab/queue'
import type { ReportState } from '../../../shared/vocab/reports'
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

type ResponseHours = { responseEmergencyHours: number; responseStandardHours: number }

/** The new row of an item: due by its own time, else its client's response time, else 36 h. */
function itemRow(item: OpenItem, client: ResponseHours | undefined, now: Date) {
  let dueBy = item.dueBy
  if (!dueBy && client) {
    const hours = item.severity === 'emergency' ? client.responseEmergencyHours : client.responseStandardHours
    // Contract hours are elapsed hours: across a clock change the local due time moves by an hour.
    dueBy = dueAfter(item.openedAt ?? now, hours)
  }
  return {
    kind: item.kind,
    openKey: `${item.kind}:${item.subject}`,
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
  }
}

const responseColumns = ['responseEmergencyHours', 'responseStandardHours'] as const

/** Opens a queue item unless one is already open for the same kind and subject; returns its id. */
export async function openItem(db: Db, item: OpenItem, now = new Date()): Promise<number> {
  const openKey = `${item.kind}:${item.subject}`
  const existing = await db('queueItems').where({ openKey }).first('id')
  if (existing) return existing.id
  const client =
    !item.dueBy && item.clientId
      ? await db('clients')
          .where({ id: item.clientId })
          .first(...responseColumns)
      : undefined
  try {
    const [id] = await db('queueItems').insert(itemRow(item, client, now))
    return id
  } catch (err) {
    // Opened at the same moment elsewhere (the job and a new report): that item is the one. A locking
    // read: a plain one inside a transaction sees only what was committed before its first read.
    if (!isDuplicate(err)) throw err
    return (await db('queueItems').where({ openKey }).forShare().first('id')).id
  }
}

/**
 * Opens many items at once (the refresh): those whose kind and subject have no open item, in a few
 * statements. One opened meanwhile elsewhere (a visit) wins: the duplicate key leaves it as it is.
 */
export async function openItems(db: Db, items: OpenItem[], now = new Date()): Promise<void> {
  const clients = new Map<number, ResponseHours | undefined>()
  for (let i = 0; i < items.length; i += 500) {
    const chunk = items.slice(i, i + 500)
    const keys = chunk.map((it) => `${it.kind}:${it.subject}`)
    const open = new Set(await db('queueItems').whereIn('openKey', keys).pluck('openKey'))
    const fresh = chunk.filter((_, k) => !open.has(keys[k]))
    if (!fresh.length) continue
    const wanted = [...new Set(fresh.map((it) => it.clientId))].filter(
      (id): id is number => !!id && !clients.has(id),
    )
    if (wanted.length)
      for (const c of await db('clients')
        .whereIn('id', wanted)
        .select('id', ...responseColumns))
        clients.set(c.id, c)
    const rows = fresh.map((it) =>
      itemRow(it, it.dueBy || !it.clientId ? undefined : clients.get(it.clientId), now),
    )
    await db('queueItems').insert(rows).onConflict('openKey').merge(['openKey'])
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
