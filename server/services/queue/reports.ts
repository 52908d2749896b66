// Public reports in the queue: a waiting report (received, in hand or scheduled) is carried by one open
// item; a second report on the same string while that item is open joins it (its own reference still
// works). When the item closes the reports move on (fixed, not ours, duplicate) with a history row
// and the fixed e-mail (report-states.ts), so the two never disagree for long.
import { reportOpenStates, type ReportState } from '../../../shared/vocab/reports'
import { dueAfter } from '../../../shared/local-time'
import { closeItems, openItem, ACTIVE } from './items'
import { catchUpReportMoves, moveReports } from './report-states'
import type { Db } from '../../db'

export {
  markReportsInHand,
  markReportsScheduled,
  moveReports,
  catchUpReportMoves,
  settleReportsOfItems,
  reportsOfItems,
} from './report-states'

interface Waiting {
  id: number
  ref: string
  hazard: number | boolean
  streetText: string | null
  createdAt: Date
  stringId: number | null
  siteId: number | null
  clientId: number | null
}

/** The open public-report item on this string, locking the string so two reports at once make one item. */
async function itemOnString(db: Db, stringId: number) {
  await db('strings').where({ id: stringId }).forUpdate().first('id')
  return db('queueItems')
    .where({ kind: 'public_report', stringId })
    .whereIn('state', ACTIVE)
    .orderBy('id')
    .first('id', 'severity', 'dueBy', 'clientId', 'reportId')
}

/** A new report joins an open item: a hazard makes it an emergency, and it takes the item's progress. */
async function joinItem(db: Db, r: Waiting, item: Awaited<ReturnType<typeof itemOnString>>, now: Date) {
  await db('reports').where({ id: r.id }).update({ queueItemId: item.id })
  if (r.hazard && item.severity !== 'emergency') {
    const c = item.clientId
      ? await db('clients').where({ id: item.clientId }).first('responseEmergencyHours')
      : null
    const due = c ? dueAfter(new Date(r.createdAt), c.responseEmergencyHours) : new Date(item.dueBy)
    await db('queueItems')
      .where({ id: item.id })
      .update({
        severity: 'emergency',
        dueBy: due < new Date(item.dueBy) ? due : item.dueBy,
        summary:
          `${r.ref}: hazard reported on ${r.streetText ?? 'unknown street'}, after an earlier report`.slice(
            0,
            255,
          ),
      })
  }
  const lead = item.reportId ? await db('reports').where({ id: item.reportId }).first('state') : null
  if (lead && lead.state !== 'received' && (reportOpenStates as readonly string[]).includes(lead.state))
    await moveReports(db, [r.id], lead.state as ReportState, now)
}

/** Opens or joins an item for each waiting report (only those in `ids` when given) that has no open one. */
export async function openReportItems(db: Db, now = new Date(), ids?: number[]) {
  // A report without a tag is placed by the street the reporter named.
  const q = db('reports as r')
    .leftJoin('strings as s', 's.id', 'r.stringId')
    .leftJoin('sites as si', (j) => j.on('si.id', 's.siteId').orOn('si.name', 'r.streetText'))
    .leftJoin('queueItems as carrier', 'carrier.id', 'r.queueItemId')
    .whereIn('r.state', reportOpenStates)
    .where((w) => w.whereNull('carrier.id').orWhereNotIn('carrier.state', ACTIVE))
    .orderBy('r.id')
    .select(
      'r.id',
      'r.ref',
      'r.hazard',
      'r.streetText',
      'r.createdAt',
      'r.stringId',
      'si.id as siteId',
      'si.clientId',
    )
  if (ids) q.whereIn('r.id', ids)
  const reports: Waiting[] = await q
  const defaultClient = (await db('clients').orderBy('id').first('id'))?.id ?? null
  for (const r of reports) {
    const shared = r.stringId ? await itemOnString(db, r.stringId) : undefined
    if (shared) {
      await joinItem(db, r, shared, now)
      continue
    }
    const what = r.hazard ? 'hazard reported' : 'fault reported'
    const itemId = await openItem(
      db,
      {
        kind: 'public_report',
        subject: `report:${r.id}`,
        severity: r.hazard ? 'emergency' : 'standard',
        reportId: r.id,
        stringId: r.stringId ?? null,
        siteId: r.siteId ?? null,
        clientId: r.clientId ?? defaultClient,
        openedAt: new Date(r.createdAt),
        summary: `${r.ref}: ${what} on ${r.streetText ?? 'unknown street'}`,
      },
      now,
    )
    await db('reports').where({ id: r.id }).update({ queueItemId: itemId })
  }
}

/**
 * Reports whose carrying item was closed or merged without them (before settleReports moved linked
 * reports too) follow the item's own report: fixed, not ours or duplicate; a merged item's, duplicate.
 */
export async function followClosedItems(db: Db, now = new Date()) {
  const rows = await db('reports as r')
    .join('queueItems as q', 'q.id', 'r.queueItemId')
    .leftJoin('reports as lead', 'lead.id', 'q.reportId')
    .whereIn('r.state', reportOpenStates)
    .whereNotIn('q.state', ACTIVE)
    .select('r.id', 'q.state as itemState', 'lead.state as leadState')
  const byState = new Map<ReportState, number[]>()
  for (const r of rows) {
    const leadState = r.leadState as ReportState | null
    const state: ReportState | null =
      r.itemState === 'merged'
        ? 'duplicate'
        : leadState && !(reportOpenStates as readonly string[]).includes(leadState)
          ? leadState
          : null
    if (state) byState.set(state, [...(byState.get(state) ?? []), r.id as number])
  }
  for (const [state, ids] of byState) await moveReports(db, ids, state, now)
}

/** Closes the items of reports whose state has moved on without them (set by hand, for one). */
export async function closeSettledReportItems(db: Db, now = new Date()) {
  const rows = await db('queueItems')
    .where('kind', 'public_report')
    .whereIn('state', ACTIVE)
    .whereIn('reportId', db('reports').whereNotIn('state', reportOpenStates).select('id'))
    .whereNotIn(
      'id',
      db('reports').whereIn('state', reportOpenStates).whereNotNull('queueItemId').select('queueItemId'),
    )
    .select('id')
  await closeItems(
    db,
    rows.map((r) => r.id as number),
    { now },
  )
}

export async function syncReportItems(db: Db, now = new Date()) {
  await catchUpReportMoves(db)
  await followClosedItems(db, now)
  await openReportItems(db, now)
  await closeSettledReportItems(db, now)
}
