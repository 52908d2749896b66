import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import type { QueueItem } from '../../shared/schemas/queue'
import { scoreItem } from './queue-score'

const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : d == null ? null : String(d))

export interface QueueFilter {
  clientId?: number
  siteId?: number
  kind?: QueueItem['kind']
  crewId?: number
  /** 'active' is open or snoozed: work still waiting. */
  state: 'open' | 'snoozed' | 'closed' | 'active' | 'all'
  ids?: number[]
}

const STATES = { active: ['open', 'snoozed'], all: ['open', 'snoozed', 'closed'] } as const

export async function listQueue(db: Db, f: QueueFilter, now = new Date()): Promise<QueueItem[]> {
  const q = db('queueItems as q')
    .leftJoin('strings as s', 's.id', 'q.stringId')
    .leftJoin('sites as si', 'si.id', db.raw('coalesce(q.site_id, s.site_id)'))
    .leftJoin('clients as c', 'c.id', 'q.clientId')
    .leftJoin('reports as r', 'r.id', 'q.reportId')
    .select(
      'q.*',
      's.assetTag',
      's.name as stringName',
      's.status as stringStatus',
      's.lampsOut',
      's.maxRatio',
      's.lat as sLat',
      's.lng as sLng',
      'si.id as siteId2',
      'si.name as siteName',
      'si.importance',
      'si.accessFrom',
      'si.accessTo',
      'si.lat as siteLat',
      'si.lng as siteLng',
      'c.name as clientName',
      'c.responseEmergencyHours',
      'c.responseStandardHours',
      'r.ref as reportRef',
      'r.hazard',
      'r.lat as rLat',
      'r.lng as rLng',
      db.raw('(select count(*) from queue_items m where m.merged_into_id = q.id) as merged_count'),
    )
  if (f.state === 'active' || f.state === 'all') q.whereIn('q.state', [...STATES[f.state]])
  else q.where('q.state', f.state)
  if (f.ids) q.whereIn('q.id', f.ids)
  if (f.clientId) q.where('q.clientId', f.clientId)
  if (f.siteId) q.where('si.id', f.siteId)
  if (f.kind) q.where('q.kind', f.kind)
  if (f.crewId) {
    q.whereIn(
      'q.id',
      db('runStops as rs')
        .join('runs as ru', 'ru.id', 'rs.runId')
        .where('ru.crewId', f.crewId)
        .whereNotNull('rs.queueItemId')
        .select('rs.queueItemId'),
    )
  }
  const rows = await q.limit(2000)
  const planned = await db('runStops as rs')
    .join('runs as ru', 'ru.id', 'rs.runId')
    .where('ru.runDate', '>=', now.toISOString().slice(0, 10))
    .whereNotNull('rs.queueItemId')
    .select('rs.queueItemId', 'ru.crewId')
  const plannedBy = new Map(planned.map((p) => [p.queueItemId as number, p.crewId as number]))
  const items = rows.map((r) => {
    const { score, parts, why, hoursLeft } = scoreItem(r, now)
    return {
      id: r.id,
      kind: r.kind,
      severity: r.severity,
      state: r.state,
      summary: r.summary,
      openedAt: iso(r.openedAt)!,
      dueBy: iso(r.dueBy)!,
      hoursLeft,
      overdue: hoursLeft < 0,
      score,
      scoreParts: parts,
      why,
      snoozedUntil: iso(r.snoozedUntil),
      snoozeReason: r.snoozeReason ?? null,
      mergedCount: Number(r.mergedCount ?? 0),
      string: r.stringId
        ? {
            id: r.stringId,
            assetTag: r.assetTag,
            name: r.stringName,
            status: r.stringStatus,
            lampsOut: r.lampsOut,
          }
        : null,
      site: r.siteId2
        ? { id: r.siteId2, name: r.siteName, accessFrom: r.accessFrom ?? null, accessTo: r.accessTo ?? null }
        : null,
      client: r.clientId ? { id: r.clientId, name: r.clientName } : null,
      lat: r.sLat ?? r.rLat ?? r.siteLat ?? null,
      lng: r.sLng ?? r.rLng ?? r.siteLng ?? null,
      reportRef: r.reportRef ?? null,
      plannedCrewId: plannedBy.get(r.id) ?? null,
    } satisfies QueueItem
  })
  return items.sort((a, b) => b.score - a.score)
}

async function openOrSnoozed(db: Db, id: number) {
  const item = await db('queueItems').where({ id }).first('id', 'state')
  if (!item) throw notFound('Queue item')
  if (!['open', 'snoozed'].includes(item.state))
    throw badRequest('item_closed', 'This item is already closed or merged.')
  return item
}

export async function snoozeItem(db: Db, id: number, until: Date, reason: string, now = new Date()) {
  await openOrSnoozed(db, id)
  if (until <= now)
    throw badRequest('validation_failed', 'Snooze until a time in the future.', {
      fields: [{ path: 'body.until', message: 'Must be in the future.' }],
    })
  await db('queueItems').where({ id }).update({ state: 'snoozed', snoozedUntil: until, snoozeReason: reason })
}

export async function mergeItems(db: Db, into: number, ids: number[]) {
  if (ids.includes(into))
    throw badRequest('validation_failed', 'An item cannot be merged into itself.', {
      fields: [{ path: 'body.ids', message: 'Remove the target.' }],
    })
  await db.transaction(async (trx) => {
    await openOrSnoozed(trx as unknown as Db, into)
    for (const id of ids) await openOrSnoozed(trx as unknown as Db, id)
    await trx('queueItems')
      .whereIn('id', ids)
      .update({ state: 'merged', mergedIntoId: into, openKey: null, closedAt: new Date() })
  })
}

export async function closeItem(db: Db, id: number, reason: string) {
  await openOrSnoozed(db, id)
  await db('queueItems')
    .where({ id })
    .update({ state: 'closed', openKey: null, closedAt: new Date(), snoozeReason: reason })
}
