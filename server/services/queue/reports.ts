// Public reports in the queue: a report waiting for us (received or in hand) has one open item; when
// its state moves on (fixed, not ours, duplicate) the item closes. Closing the item moves the report
// (items.ts), so the two never disagree for long.
import { reportOpenStates } from '../../../shared/schemas/reports'
import { closeItems, openItem, ACTIVE } from './items'
import type { Db } from '../../db'

/** Opens an item for each waiting report (only those in `ids` when given) that has none open. */
export async function openReportItems(db: Db, now = new Date(), ids?: number[]) {
  // A report without a tag is placed by the street the reporter named.
  const q = db('reports as r')
    .leftJoin('strings as s', 's.id', 'r.stringId')
    .leftJoin('sites as si', (j) => j.on('si.id', 's.siteId').orOn('si.name', 'r.streetText'))
    .whereIn('r.state', reportOpenStates)
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
  const reports = await q
  const defaultClient = (await db('clients').orderBy('id').first('id'))?.id ?? null
  for (const r of reports) {
    const what = r.hazard ? 'hazard reported' : 'fault reported'
    await openItem(
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
  }
}

/** Closes the items of reports whose state has moved on without them (set by hand, for one). */
export async function closeSettledReportItems(db: Db, now = new Date()) {
  const rows = await db('queueItems')
    .where('kind', 'public_report')
    .whereIn('state', ACTIVE)
    .whereIn('reportId', db('reports').whereNotIn('state', reportOpenStates).select('id'))
    .select('id')
  await closeItems(
    db,
    rows.map((r) => r.id as number),
    { now },
  )
}

export async function syncReportItems(db: Db, now = new Date()) {
  await openReportItems(db, now)
  await closeSettledReportItems(db, now)
}
