// The queue as supervisors see it: waiting work with its place, client, report and score.
import type { QueueItem, QueueKind } from '../../../shared/schemas/queue'
import { scoreItem } from './score'
import type { Db } from '../../db'
import { iso, isoOrNull } from '../../../shared/iso-time'
import { localDay } from '../../../shared/local-time'
import { config } from '../../config'

export interface QueueFilter {
  clientId?: number
  siteId?: number
  kind?: QueueKind
  crewId?: number
  /** 'active' is open or snoozed: work still waiting. */
  state: 'open' | 'snoozed' | 'closed' | 'active' | 'all'
  ids?: number[]
}

const STATES = { active: ['open', 'snoozed'], all: ['open', 'snoozed', 'closed'] } as const

export async function listQueue(db: Db, f: QueueFilter, now = new Date()): Promise<QueueItem[]> {
  const q = db('queueItems as q')
    .leftJoin('strings as s', 's.id', 'q.stringId')
    .leftJoin('stringTypes as st', 'st.id', 's.typeId')
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
      's.replaceRule',
      's.riskNote',
      'st.replaceAtRatio',
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
    .where('ru.runDate', '>=', localDay(now, config.APP_TIME_ZONE))
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
      openedAt: iso(r.openedAt),
      dueBy: iso(r.dueBy),
      hoursLeft,
      overdue: hoursLeft < 0,
      score,
      scoreParts: parts,
      why,
      snoozedUntil: isoOrNull(r.snoozedUntil),
      snoozeReason: r.snoozeReason ?? null,
      closeReason: r.closeReason ?? null,
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
