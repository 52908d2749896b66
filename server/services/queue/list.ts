// The queue as supervisors see it: waiting work with its place, client, report and score.
import type { QueueItem } from '../../../shared/schemas/queue'
import type { QueueKind } from '../../../shared/vocab/queue'
import { scoreItem } from './score'
import type { Db } from '../../db'
import { iso, isoOrNull } from '../../../shared/iso-time'
import { localDay } from '../../../shared/local-time'
import { config } from '../../config'
import { scoreSql } from './score-sql'
import { byRank } from '../../../shared/schemas/report-work'
import { reportNotesForItems } from '../report-notes'
import { STATE_KINDS, stringItemSummary } from './string-items'

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

/**
 * The queue's items under the filter (not yet ordered nor limited), joined to what an item shows;
 * a count joins only what the site filter needs.
 */
function queueRows(db: Db, f: QueueFilter, joins: 'all' | 'count' = 'all') {
  const q = db('queueItems as q')
  if (joins === 'all' || f.siteId)
    q.leftJoin('strings as s', 's.id', 'q.stringId').leftJoin(
      'sites as si',
      'si.id',
      db.raw('coalesce(q.site_id, s.site_id)'),
    )
  if (joins === 'all')
    q.leftJoin('stringTypes as st', 'st.id', 's.typeId')
      .leftJoin('clients as c', 'c.id', 'q.clientId')
      .leftJoin('reports as r', 'r.id', 'q.reportId')
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
  return q
}

const selectItem = (db: Db, q: ReturnType<typeof queueRows>) =>
  q.select(
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

/**
 * One page of the queue, most urgent first, sorted in SQL (emergencies first, then the score of
 * score-sql.ts, then the oldest id), with the number of items under the filter.
 */
export async function listQueuePage(
  db: Db,
  f: QueueFilter & { page: number; pageSize: number },
  now = new Date(),
): Promise<{ items: QueueItem[]; total: number }> {
  const [{ n }] = await queueRows(db, f, 'count').count({ n: '*' })
  // The page's ids first, then their rows: the merged-items count is worked out for 50 rows, not all.
  const page = await queueRows(db, f)
    .select('q.id')
    .orderByRaw("q.severity = 'emergency' desc")
    .orderBy(scoreSql(db, now) as unknown as string, 'desc')
    .orderBy('q.id')
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize)
  const ids = page.map((r) => r.id as number)
  const rows = ids.length ? await selectItem(db, queueRows(db, { ...f, ids })) : []
  const at = new Map(ids.map((id, i) => [id, i]))
  rows.sort((a, b) => at.get(a.id)! - at.get(b.id)!)
  // SQL's score and score.ts's rounded one can differ in the last decimal: within the page the order
  // follows the score people read (a stable sort, so SQL's order stands between equals).
  return { items: (await toItems(db, rows, now)).sort(byRank), total: Number(n) }
}

export async function listQueue(db: Db, f: QueueFilter, now = new Date()): Promise<QueueItem[]> {
  const rows = await selectItem(db, queueRows(db, f)).limit(2000)
  const items = await toItems(db, rows, now)
  // Emergencies first whatever their score, then by score (report-work.ts byRank).
  return items.sort(byRank)
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- rows of selectItem as Knex returns them
async function toItems(db: Db, rows: any[], now: Date): Promise<QueueItem[]> {
  const planned = await db('runStops as rs')
    .join('runs as ru', 'ru.id', 'rs.runId')
    .where('ru.runDate', '>=', localDay(now, config.APP_TIME_ZONE))
    .whereIn(
      'rs.queueItemId',
      rows.map((r) => r.id as number),
    )
    .select('rs.queueItemId', 'ru.crewId')
  const plannedBy = new Map(planned.map((p) => [p.queueItemId as number, p.crewId as number]))
  // The reporters' own words on each public-report item (nothing personal).
  const notes = await reportNotesForItems(
    db,
    rows.filter((r) => r.kind === 'public_report').map((r) => r.id as number),
  )
  return rows.map((r) => {
    const { score, parts, why, hoursLeft } = scoreItem(r, now)
    return {
      id: r.id,
      kind: r.kind,
      severity: r.severity,
      state: r.state,
      // A waiting state item reads the string's current count (the stored title is from when it opened).
      summary:
        r.stringId && r.state !== 'closed' && r.state !== 'merged' && STATE_KINDS.includes(r.kind)
          ? stringItemSummary(r.kind, { ...r, name: r.stringName })
          : r.summary,
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
      reports: notes.get(r.id) ?? [],
    } satisfies QueueItem
  })
}
